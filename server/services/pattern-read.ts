/**
 * `GET /api/patterns/:id` in one database round trip.
 *
 * The pattern page is the most read route (every studio open, every knitter
 * opening a release), so it reads the pattern, its owner's name, the caller's
 * membership and active entitlement, and the newest revision the caller may
 * read (with its author's name) in one SELECT of only the columns the answer
 * needs, instead of one query each.
 *
 * The access decision is still made here in code, by the same rules as
 * {@link authorizePattern} ({@link roleFrom} and {@link enforceAccess} in
 * access.ts), on every request. The SQL only chooses which revision row to
 * join: the latest for the owner and editors, the released one for other
 * members and buyers, none for anybody else, so a revision a caller may not
 * read is never even loaded. The joined row is used only when its number is
 * the one {@link newestVisibleRevision} names for the role; otherwise it is
 * read again by number (a safety net that the tests show is not taken).
 *
 * The stored summary is JSON written by the server itself (Revision's setter),
 * so it is passed through as text rather than parsed and serialised again for
 * each request ({@link patternReadBody}).
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import type { ApiPattern, ApiRevision } from '../../shared/api-schemas.ts';
import { Revision, User, type MemberRole, type PatternStatus } from '../models/index.ts';
import { enforceAccess, isPatternId, newestVisibleRevision, roleFrom } from './access.ts';
import { notFound, unauthorized } from './errors.ts';
import { toApiPattern } from './patterns.ts';
import { toApiRevision } from './serialize.ts';

/** A pattern as the caller may see it, with the newest readable revision; its summary still as stored JSON text. */
export interface PatternRead {
  pattern: ApiPattern;
  /** Everything of the revision except `summary` (which is {@link summaryJson}). */
  latestRevision: Omit<ApiRevision, 'summary'> | null;
  /** The revision's stored summary, JSON text exactly as stored ('null' when none). */
  summaryJson: string;
}

interface Row {
  id: number; ownerId: number; title: string; status: PatternStatus; latestRevision: number; approvedRevision: number | null; releasedRevision: number | null;
  createdAt: Date; updatedAt: Date; ownerName: string | null; memberRole: MemberRole | null; entitled: number | null;
  revId: number | null; revNumber: number | null; revMessage: string | null; revErrors: number | null; revWarnings: number | null;
  revCreatedAt: Date | null; revSource: string | null; revSummary: string | null; authorId: number | null; authorName: string | null;
}

// Every join is on a primary key or a unique index: users(id), memberships(patternId, userId),
// entitlements(userId, patternId), revisions(patternId, number); so the row count is 0 or 1.
// $1 = pattern id, $2 = caller's user id.
const SQL = `
SELECT p.id, p.ownerId, p.title, p.status, p.latestRevision, p.approvedRevision, p.releasedRevision, p.createdAt, p.updatedAt,
  o.name AS ownerName, m.role AS memberRole, e.id AS entitled,
  r.id AS revId, r.number AS revNumber, r.message AS revMessage, r.errors AS revErrors, r.warnings AS revWarnings,
  r.createdAt AS revCreatedAt, r.source AS revSource, r.summary AS revSummary, a.id AS authorId, a.name AS authorName
FROM patterns p
LEFT JOIN users o ON o.id = p.ownerId
LEFT JOIN memberships m ON m.patternId = p.id AND m.userId = $2
LEFT JOIN entitlements e ON e.userId = $2 AND e.patternId = p.id AND e.revokedAt IS NULL
LEFT JOIN revisions r ON r.patternId = p.id AND r.number = CASE
    WHEN p.ownerId = $2 OR m.role = 'editor' THEN p.latestRevision
    WHEN m.role IS NOT NULL OR e.id IS NOT NULL THEN p.releasedRevision
  END
LEFT JOIN users a ON a.id = r.authorId
WHERE p.id = $1`;

/**
 * The pattern `patternId` and the newest revision `user` may read (with
 * source and summary). 401 without a user, 404 when the pattern does not
 * exist or the caller may not see it, exactly as {@link authorizePattern}
 * with the action `view`.
 */
export async function readPattern(sequelize: Sequelize, user: User | null, patternId: number): Promise<PatternRead> {
  if (!user) throw unauthorized();
  if (!isPatternId(patternId)) throw notFound('Pattern');
  const rows = await sequelize.query<Row>(SQL, { bind: [patternId, user.id], type: QueryTypes.SELECT, raw: true });
  const row = rows[0];
  if (!row) throw notFound('Pattern');
  const pattern = {
    id: row.id, ownerId: row.ownerId, title: row.title, status: row.status, latestRevision: row.latestRevision,
    approvedRevision: row.approvedRevision, releasedRevision: row.releasedRevision, createdAt: row.createdAt, updatedAt: row.updatedAt,
  };
  const role = enforceAccess(roleFrom(user.id, pattern, row.memberRole, row.entitled !== null), pattern, 'view');
  const number = newestVisibleRevision(role, pattern);
  const apiPattern = toApiPattern(pattern, role, row.ownerName === null ? null : { id: row.ownerId, name: row.ownerName });
  if (row.revId !== null && row.revNumber === number) {
    return {
      pattern: apiPattern,
      latestRevision: {
        id: row.revId, number: row.revNumber, message: row.revMessage ?? '', author: { id: row.authorId ?? 0, name: row.authorName ?? 'unknown' },
        errors: row.revErrors ?? 0, warnings: row.revWarnings ?? 0, createdAt: (row.revCreatedAt as Date).toISOString(), source: row.revSource ?? '',
      },
      summaryJson: row.revSummary ?? 'null',
    };
  }
  // The join did not bring the revision this role reads (none exists, or the SQL's choice and the policy disagree).
  const revision = number > 0 ? await Revision.findOne({ where: { patternId: pattern.id, number }, include: [{ model: User, as: 'author' }] }) : null;
  if (!revision) return { pattern: apiPattern, latestRevision: null, summaryJson: 'null' };
  const { summary, ...rest } = toApiRevision(revision, true);
  return { pattern: apiPattern, latestRevision: rest, summaryJson: JSON.stringify(summary ?? null) };
}

/**
 * The JSON body of `GET /api/patterns/:id`: `{pattern, latestRevision}` with
 * the stored summary put in as `latestRevision.summary` without parsing it.
 * `latestRevision` is the last member of the outer object and `summary` goes
 * last inside it, so the text before the final two braces is complete.
 */
export function patternReadBody(read: PatternRead): string {
  if (!read.latestRevision) return JSON.stringify({ pattern: read.pattern, latestRevision: null });
  const text = JSON.stringify({ pattern: read.pattern, latestRevision: read.latestRevision });
  return `${text.slice(0, -2)},"summary":${read.summaryJson}}}`;
}
