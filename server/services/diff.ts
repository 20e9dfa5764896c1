/**
 * The semantic and text diff of two revisions of a pattern (shared/diff),
 * for callers who may read both revisions: the owner and editors any,
 * test knitters and knitters released ones only. The diff itself runs in
 * the export worker thread.
 */
import type { RevisionDiff } from '../../shared/diff/index.ts';
import { Revision, type User } from '../models/index.ts';
import { authorizePattern, canReadRevision } from './access.ts';
import { notFound } from './errors.ts';
import type { ExportQueue } from './exports/jobs.ts';
import { releasedNumbers } from './releases.ts';

/** `{from, to, semantic, text}`: `semantic` is shared/diff's RevisionDiff, `text` its plain-text form. 404 for a revision the caller cannot read. */
export async function diffPatternRevisions(queue: ExportQueue, user: User | null, patternId: number, from: number, to: number, size?: string): Promise<{ from: number; to: number; size: string | null; semantic: RevisionDiff; text: string }> {
  const { pattern, role } = await authorizePattern(user, patternId, 'view');
  const released = role === 'owner' || role === 'editor' ? [] : await releasedNumbers(pattern.id);
  const sources = new Map<number, string>();
  for (const n of [from, to]) {
    if (!canReadRevision(role, pattern, n, released)) throw notFound(`Revision ${n}`);
    const r = await Revision.findOne({ where: { patternId: pattern.id, number: n }, attributes: ['number', 'source'] });
    if (!r) throw notFound(`Revision ${n}`);
    sources.set(n, r.source);
  }
  // Two compiles: in the worker thread, off the event loop.
  const { semantic, text } = await queue.diff({ oldSource: sources.get(from) ?? '', newSource: sources.get(to) ?? '', size: size ?? null });
  return { from, to, size: size ?? null, semantic: semantic as RevisionDiff, text };
}
