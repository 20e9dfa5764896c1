/**
 * The access policy, in one place. Every route that touches a pattern asks
 * {@link authorizePattern} with an action; nothing else decides who may do
 * what.
 *
 * - The owner (a designer) may do everything on their pattern.
 * - An invited editor sees every revision, comments, and approves or asks
 *   for changes.
 * - An invited test knitter or knitter sees the released revision only, and
 *   only once one is released.
 * - Anybody else gets 404 (existence is not leaked); a member who can see the
 *   pattern but not do the action gets 403.
 * - A knitter who bought a listed pattern (an active entitlement, see the
 *   shop) is a knitter on it: the released revision, whichever release is
 *   newest, until a refund revokes it.
 * - Creating patterns needs the global `designer` role (or `admin`);
 *   managing accounts needs `admin`. Admins see no pattern they are not on.
 */
import { Entitlement, Membership, Pattern, type MemberRole, type User } from '../models/index.ts';
import { forbidden, notFound, unauthorized } from './errors.ts';

export type PatternRole = 'owner' | 'editor' | 'test-knitter' | 'knitter';

/** Everything one can do to a pattern. */
export type PatternAction =
  | 'view'              // the pattern and the revisions this role may see
  | 'view-all-revisions'
  | 'save-revision'
  | 'list-members'
  | 'manage-members'    // invite, remove others
  | 'comment'
  | 'submit-for-review' // owner: draft -> in-review, in-review -> draft
  | 'review'            // editor: in-review -> approved | draft
  | 'release'           // owner: approved -> released
  | 'upload'
  | 'sell'              // owner: list in the shop, see sales, refund
  | 'view-uploads'
  | 'view-review'       // the review log
  | 'export'            // export a revision the role may read
  | 'track-progress'    // keep one's place in a release
  | 'report-erratum';   // an erratum on a round of a release

/** Which pattern roles may take each action (the matrix the role test walks). */
export const POLICY: Readonly<Record<PatternAction, readonly PatternRole[]>> = {
  view: ['owner', 'editor', 'test-knitter', 'knitter'],
  'view-all-revisions': ['owner', 'editor'],
  'save-revision': ['owner'],
  'list-members': ['owner', 'editor'],
  'manage-members': ['owner'],
  comment: ['owner', 'editor'],
  'submit-for-review': ['owner'],
  review: ['editor'],
  release: ['owner'],
  upload: ['owner'],
  'view-uploads': ['owner', 'editor', 'test-knitter', 'knitter'],
  sell: ['owner'],
  'view-review': ['owner', 'editor'],
  export: ['owner', 'editor', 'test-knitter', 'knitter'],
  'track-progress': ['owner', 'editor', 'test-knitter', 'knitter'],
  'report-erratum': ['editor', 'test-knitter', 'knitter'],
};

/** True when `role` may see the pattern at all (knitters only after a release). */
export function canSee(role: PatternRole | null, pattern: Pick<Pattern, 'releasedRevision'>): boolean {
  if (role === null) return false;
  if (role === 'test-knitter' || role === 'knitter') return pattern.releasedRevision !== null && pattern.releasedRevision !== undefined;
  return true;
}

/** True when `role` may take `action` on `pattern`. */
export function isAllowed(role: PatternRole | null, action: PatternAction, pattern: Pick<Pattern, 'releasedRevision'>): boolean {
  return canSee(role, pattern) && role !== null && POLICY[action].includes(role);
}

/** Revision numbers `role` may read: all of them, or only the released one. */
export function visibleRevisions(role: PatternRole, pattern: Pick<Pattern, 'latestRevision' | 'releasedRevision'>): 'all' | number[] {
  if (role === 'owner' || role === 'editor') return 'all';
  return pattern.releasedRevision ? [pattern.releasedRevision] : [];
}

/**
 * True when `role` may read revision `number`: the owner and editors any,
 * test knitters and knitters only released ones (`released`: the numbers of
 * every release of the pattern; the newest release counts even when not listed).
 */
export function canReadRevision(role: PatternRole, pattern: Pick<Pattern, 'releasedRevision'>, number: number, released: readonly number[]): boolean {
  if (role === 'owner' || role === 'editor') return true;
  return number === pattern.releasedRevision || released.includes(number);
}

/** Newest revision number `role` may read (0 when none). */
export function newestVisibleRevision(role: PatternRole, pattern: Pick<Pattern, 'latestRevision' | 'releasedRevision'>): number {
  const v = visibleRevisions(role, pattern);
  return v === 'all' ? pattern.latestRevision : (v[0] ?? 0);
}

/**
 * The caller's role from what the database holds about them and the pattern:
 * the owner is the owner; otherwise an invitation (membership) decides;
 * otherwise an active entitlement (a purchase) makes a knitter; otherwise none.
 * `membershipRole` is null without a membership. The one rule behind
 * {@link roleOn} and the single-query read of a pattern (pattern-read.ts).
 */
export function roleFrom(userId: number, pattern: Pick<Pattern, 'ownerId'>, membershipRole: MemberRole | null, entitled: boolean): PatternRole | null {
  if (pattern.ownerId === userId) return 'owner';
  if (membershipRole) return membershipRole;
  return entitled ? 'knitter' : null;
}

/** The caller's role on a pattern, or null (see {@link roleFrom}). */
export async function roleOn(user: User, pattern: Pattern): Promise<PatternRole | null> {
  if (pattern.ownerId === user.id) return 'owner';
  const m = await Membership.findOne({ where: { patternId: pattern.id, userId: user.id } });
  if (m) return m.role;
  return (await hasEntitlement(user.id, pattern.id)) ? 'knitter' : null;
}

/** True when the user holds an active (not refunded) entitlement to the pattern. */
export async function hasEntitlement(userId: number, patternId: number): Promise<boolean> {
  return (await Entitlement.count({ where: { userId, patternId, revokedAt: null } })) > 0;
}

/** Ids of the patterns the user holds an active entitlement to (bought in the shop). */
export async function entitledPatternIds(userId: number): Promise<number[]> {
  const rows = await Entitlement.findAll({ where: { userId, revokedAt: null }, attributes: ['patternId'] });
  return rows.map((r) => r.patternId);
}

/**
 * Loads pattern `patternId` and checks that `user` may take `action` on it.
 * Throws 401 without a user, 404 when the user may not see the pattern (or it
 * does not exist), 403 when they see it but may not take the action.
 */
export async function authorizePattern(user: User | null, patternId: number, action: PatternAction): Promise<{ pattern: Pattern; role: PatternRole }> {
  if (!user) throw unauthorized();
  const pattern = isPatternId(patternId) ? await Pattern.findByPk(patternId) : null;
  if (!pattern) throw notFound('Pattern');
  return { pattern, role: enforceAccess(await roleOn(user, pattern), pattern, action) };
}

/** True when `patternId` can name a pattern (a positive safe integer); anything else is 404 without a query. */
export function isPatternId(patternId: number): boolean {
  return Number.isSafeInteger(patternId) && patternId > 0;
}

/**
 * The decision of {@link authorizePattern} once the pattern and the caller's
 * role are known: returns the role, or throws 404 when the role may not see
 * the pattern (none, or a knitter before any release), 403 when it sees it
 * but may not take `action`.
 */
export function enforceAccess(role: PatternRole | null, pattern: Pick<Pattern, 'releasedRevision'>, action: PatternAction): PatternRole {
  if (!canSee(role, pattern) || role === null) throw notFound('Pattern');
  if (!POLICY[action].includes(role)) throw forbidden(`As ${role === 'editor' ? 'an' : 'a'} ${role} on this pattern you may not do that.`);
  return role;
}

/** Throws unless `user` may create patterns (global designer or admin). */
export function authorizeCreatePattern(user: User | null): User {
  if (!user) throw unauthorized();
  if (!user.hasRole('designer') && !user.hasRole('admin')) throw forbidden('Only designers can create patterns.');
  return user;
}

/** Throws unless `user` is an admin (account management). */
export function authorizeAdmin(user: User | null): User {
  if (!user) throw unauthorized();
  if (!user.hasRole('admin')) throw forbidden('Only admins manage accounts.');
  return user;
}

/** Throws 401 unless signed in. */
export function requireUser(user: User | null): User {
  if (!user) throw unauthorized();
  return user;
}
