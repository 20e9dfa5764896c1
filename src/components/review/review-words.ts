/** Plain-words helpers of the review pages: the status sentence, the next version label, round and line anchors. */
import type { ApiRelease } from '../../../shared/api-schemas';
import type { ReviewState } from '../../api/useReview';

/** Compares version labels number by number ("1.10" after "1.9"; "1.0" after "1"). */
export function compareLabels(a: string, b: string): number {
  const pa = a.split('.').map(Number), pb = b.split('.').map(Number);
  for (let i = 0; i < Math.max(pa.length, pb.length); i++) {
    const d = (pa[i] ?? -1) - (pb[i] ?? -1);
    if (d !== 0) return d;
  }
  return 0;
}

/** The label to suggest after `labels`: "1.0" first, then the last number raised by one. */
export function nextLabel(labels: readonly string[]): string {
  const newest = [...labels].sort(compareLabels).at(-1);
  if (!newest) return '1.0';
  const parts = newest.split('.').map(Number);
  parts[parts.length - 1] = (parts.at(-1) ?? 0) + 1;
  return parts.join('.');
}

/** One sentence saying where the review stands, from the state and its log. */
export function statusSentence(review: ReviewState, releases: ApiRelease[]): string {
  const last = [...review.events].reverse().find((e) => e.to === review.status);
  const newest = releases[0];
  switch (review.status) {
    case 'draft':
      return newest ? `Draft. Version ${newest.label} (revision #${newest.revision}) is what knitters see.` : 'Draft: not yet sent for review.';
    case 'in-review':
      return `In review: revision #${last?.revision ?? '?'} was sent to ${last?.editor?.name ?? 'every invited editor'}${last ? ` by ${last.actor.name}` : ''}.`;
    case 'changes-requested':
      return `Changes requested on revision #${last?.revision ?? '?'}${last ? ` by ${last.actor.name}` : ''}${last?.message ? `: “${last.message}”` : '.'}`;
    case 'approved':
      return `Approved: revision #${review.approvedRevision ?? '?'}${last ? ` by ${last.actor.name}` : ''}. Ready to release.`;
    case 'released':
      return newest ? `Released as version ${newest.label} (revision #${newest.revision}).` : 'Released.';
  }
}

/** "Round 12", "Row 3" or "Lines 4–6" for a comment's anchor, or null when it has none. */
export function anchorLabel(c: { round: number | null; fromLine: number | null; toLine: number | null }, word: 'Round' | 'Row' = 'Round'): string | null {
  const parts: string[] = [];
  if (c.round !== null) parts.push(`${word} ${c.round}`);
  if (c.fromLine !== null) parts.push(c.toLine !== null && c.toLine !== c.fromLine ? `lines ${c.fromLine}–${c.toLine}` : `line ${c.fromLine}`);
  if (!parts.length) return null;
  const s = parts.join(', ');
  return s[0].toUpperCase() + s.slice(1);
}
