/**
 * Release look-ups shared by the review, knitting, diff and export services,
 * and the revision numbers a role may read once several versions are
 * released (test knitters and knitters read every released revision).
 */
import { Op } from 'sequelize';
import { Release, type Pattern } from '../models/index.ts';
import { visibleRevisions, type PatternRole } from './access.ts';
import { notFound } from './errors.ts';

/** Revision numbers released on a pattern (for the access checks of knitters). */
export async function releasedNumbers(patternId: number): Promise<number[]> {
  const rows = await Release.findAll({ where: { patternId }, attributes: ['revisionNumber'] });
  return rows.map((r) => r.revisionNumber);
}

/** One release by label; 404 when unknown. */
export async function findRelease(patternId: number, label: string): Promise<Release> {
  const r = await Release.findOne({ where: { patternId, label: { [Op.eq]: label } } });
  if (!r) throw notFound(`Release ${label}`);
  return r;
}

/** Revision numbers `role` may read: 'all' for the owner and editors, else every released one. */
export async function readableRevisions(role: PatternRole, pattern: Pick<Pattern, 'id' | 'latestRevision' | 'releasedRevision'>): Promise<'all' | number[]> {
  const visible = visibleRevisions(role, pattern);
  if (visible === 'all') return 'all';
  const released = await releasedNumbers(pattern.id);
  return [...new Set([...visible, ...released])].sort((a, b) => b - a);
}
