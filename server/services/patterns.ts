/**
 * Patterns and their revisions. Revisions are immutable and numbered from 1
 * per pattern; a save names the revision it was based on, and a save on a
 * stale base is refused (409) without writing anything. Numbering happens
 * in a transaction holding the pattern row (SELECT ... FOR UPDATE), and a
 * unique index on (patternId, number) backs it up.
 */
import { Op, UniqueConstraintError, type Transaction } from 'sequelize';
import { SOURCE_MAX_BYTES, type ApiPattern, type ApiPatternListItem, type ApiRevision } from '../../shared/api-schemas.ts';
import type { ServerContext } from '../context.ts';
import { Membership, Pattern, Revision, User } from '../models/index.ts';
import { authorizePattern, canSee, entitledPatternIds, newestVisibleRevision, type PatternRole } from './access.ts';
import { AppError, conflict, notFound, tooLarge } from './errors.ts';
import { toApiRevision, toPerson } from './serialize.ts';
import { summarizeSource } from './compile-summary.ts';
import { readableRevisions } from './releases.ts';

/** Throws 413 when `source` is over {@link SOURCE_MAX_BYTES} UTF-8 bytes. */
export function checkSourceSize(source: string): void {
  const bytes = Buffer.byteLength(source, 'utf8');
  if (bytes > SOURCE_MAX_BYTES) {
    throw tooLarge(`The source is ${bytes} bytes; the limit is ${SOURCE_MAX_BYTES} bytes (1 MiB).`, SOURCE_MAX_BYTES);
  }
}

/** The columns of a pattern that {@link toApiPattern} reads. */
export type PatternFields = Pick<Pattern, 'id' | 'title' | 'status' | 'latestRevision' | 'approvedRevision' | 'releasedRevision' | 'createdAt' | 'updatedAt'>;

/** The pattern as the caller with `role` sees it (`owner`: at least id and name; missing shows as unknown). */
export function toApiPattern(pattern: PatternFields, role: PatternRole, owner: Pick<User, 'id' | 'name'> | undefined | null): ApiPattern {
  return {
    id: pattern.id,
    title: pattern.title,
    status: pattern.status,
    owner: toPerson(owner),
    latestRevision: newestVisibleRevision(role, pattern),
    approvedRevision: role === 'owner' || role === 'editor' ? (pattern.approvedRevision ?? null) : null,
    releasedRevision: pattern.releasedRevision ?? null,
    myRole: role,
    createdAt: pattern.createdAt.toISOString(),
    updatedAt: pattern.updatedAt.toISOString(),
  };
}

const withAuthor = { model: User, as: 'author' } as const;

async function writeRevision(t: Transaction, pattern: Pattern, number: number, author: User, source: string, message: string): Promise<Revision> {
  const { summary, errors, warnings } = summarizeSource(source);
  const revision = await Revision.create({ patternId: pattern.id, number, source, authorId: author.id, message, summary, errors, warnings }, { transaction: t });
  revision.author = author;
  return revision;
}

/** Creates a pattern owned by `user` with revision 1. */
export async function createPattern(ctx: ServerContext, user: User, title: string, source: string, message = 'First version'): Promise<{ pattern: ApiPattern; revision: ApiRevision }> {
  checkSourceSize(source);
  return ctx.sequelize.transaction(async (t) => {
    const pattern = await Pattern.create({ ownerId: user.id, title, latestRevision: 1 }, { transaction: t });
    const revision = await writeRevision(t, pattern, 1, user, source, message);
    return { pattern: toApiPattern(pattern, 'owner', user), revision: toApiRevision(revision, true) };
  });
}

/** Patterns the user may see, most recently changed first. */
export async function listPatterns(user: User): Promise<ApiPatternListItem[]> {
  const owned = await Pattern.findAll({ where: { ownerId: user.id } });
  const memberships = await Membership.findAll({ where: { userId: user.id }, include: [{ model: Pattern, as: 'pattern' }] });
  const entries: { pattern: Pattern; role: PatternRole }[] = owned.map((pattern) => ({ pattern, role: 'owner' as const }));
  for (const m of memberships) if (m.pattern && canSee(m.role, m.pattern)) entries.push({ pattern: m.pattern, role: m.role });
  // Patterns bought in the shop (and not shared otherwise) are in the buyer's library as a knitter.
  const listed = new Set(entries.map((e) => e.pattern.id));
  const bought = (await entitledPatternIds(user.id)).filter((id) => !listed.has(id));
  if (bought.length) for (const p of await Pattern.findAll({ where: { id: bought } })) if (canSee('knitter', p)) entries.push({ pattern: p, role: 'knitter' });
  if (entries.length === 0) return [];
  const wanted = entries.map((e) => ({ patternId: e.pattern.id, number: newestVisibleRevision(e.role, e.pattern) }));
  const revisions = await Revision.findAll({
    where: { [Op.or]: wanted },
    attributes: ['id', 'patternId', 'number', 'authorId', 'summary', 'errors', 'warnings', 'createdAt', 'message'],
    include: [withAuthor],
  });
  const byKey = new Map(revisions.map((r) => [`${r.patternId}:${r.number}`, r]));
  return entries
    .map(({ pattern, role }) => {
      const number = newestVisibleRevision(role, pattern);
      const r = byKey.get(`${pattern.id}:${number}`);
      return {
        id: pattern.id,
        title: pattern.title,
        status: pattern.status,
        sizes: r?.summary?.sizes.map((s) => s.name) ?? [],
        latestRevision: number,
        latestAuthor: toPerson(r?.author),
        errors: r?.errors ?? 0,
        warnings: r?.warnings ?? 0,
        updatedAt: pattern.updatedAt.toISOString(),
        myRole: role,
      };
    })
    .sort((a, b) => b.updatedAt.localeCompare(a.updatedAt) || b.id - a.id);
}

async function latestWithSource(patternId: number): Promise<ApiRevision | null> {
  const latest = await Revision.findOne({ where: { patternId }, order: [['number', 'DESC']], include: [withAuthor] });
  return latest ? toApiRevision(latest, true) : null;
}

const STALE_MESSAGE = 'Someone saved a newer revision since you started editing. Nothing was overwritten; compare with the latest and save again.';

/**
 * Saves a new revision on top of `baseRevision`. 409 `stale-revision` with
 * `latest` when the base is not the newest revision; nothing is written then.
 */
export async function saveRevision(ctx: ServerContext, user: User | null, patternId: number, body: { source: string; baseRevision: number; message: string }): Promise<ApiRevision> {
  const { pattern: checked } = await authorizePattern(user, patternId, 'save-revision');
  checkSourceSize(body.source);
  const author = user as User;
  try {
    return await ctx.sequelize.transaction(async (t) => {
      const pattern = await Pattern.findByPk(checked.id, { transaction: t, lock: t.LOCK.UPDATE });
      if (!pattern) throw notFound('Pattern');
      if (pattern.latestRevision !== body.baseRevision) throw conflict('stale-revision', STALE_MESSAGE);
      const number = pattern.latestRevision + 1;
      const revision = await writeRevision(t, pattern, number, author, body.source, body.message);
      pattern.latestRevision = number;
      pattern.changed('updatedAt', true);
      await pattern.save({ transaction: t });
      return toApiRevision(revision, true);
    });
  } catch (err) {
    const isStale = err instanceof UniqueConstraintError || (err instanceof AppError && err.code === 'stale-revision');
    if (isStale) throw conflict('stale-revision', STALE_MESSAGE, { latest: await latestWithSource(checked.id) });
    throw err;
  }
}

/** Revisions the caller may read, newest first, without sources. */
export async function listRevisions(user: User | null, patternId: number): Promise<ApiRevision[]> {
  const { pattern, role } = await authorizePattern(user, patternId, 'view');
  const visible = await readableRevisions(role, pattern);
  const revisions = await Revision.findAll({
    where: visible === 'all' ? { patternId: pattern.id } : { patternId: pattern.id, number: visible },
    attributes: { exclude: ['source', 'summary'] },
    order: [['number', 'DESC']],
    include: [withAuthor],
  });
  return revisions.map((r) => toApiRevision(r, false));
}

/** One revision with source and summary; 404 when it does not exist or the caller may not read it. */
export async function getRevision(user: User | null, patternId: number, number: number): Promise<ApiRevision> {
  const { pattern, role } = await authorizePattern(user, patternId, 'view');
  const visible = await readableRevisions(role, pattern);
  if (!Number.isSafeInteger(number) || (visible !== 'all' && !visible.includes(number))) throw notFound('Revision');
  const revision = await Revision.findOne({ where: { patternId: pattern.id, number }, include: [withAuthor] });
  if (!revision) throw notFound('Revision');
  return toApiRevision(revision, true);
}
