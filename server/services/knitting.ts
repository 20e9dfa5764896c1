/**
 * The knitter's side of a release: progress per knitter, release and size
 * (rounds marked done and the current round), and errata, which reach the
 * designer as a comment on the released revision and a mail.
 */
import type { ApiComment, ApiProgress } from '../../shared/api-schemas.ts';
import type { ServerContext } from '../context.ts';
import { erratumMail } from '../mail/review-templates.ts';
import { Comment, KnittingProgress, type Pattern, Release, Revision, User } from '../models/index.ts';
import { authorizePattern, type PatternAction } from './access.ts';
import { toApiComment } from './comments.ts';
import { badRequest, notFound } from './errors.ts';
import { findRelease } from './releases.ts';

interface ReleaseContext { pattern: Pattern; release: Release; revision: Revision; sizes: { name: string; rounds: number }[] }

/** Loads a release by label with its revision's sizes, after checking `action` on the pattern. */
async function openRelease(user: User | null, patternId: number, label: string, action: PatternAction): Promise<ReleaseContext> {
  const { pattern } = await authorizePattern(user, patternId, action);
  const release = await findRelease(pattern.id, label);
  const revision = await Revision.findByPk(release.revisionId, { attributes: ['id', 'number', 'summary', 'patternId'] });
  if (!revision) throw notFound(`Release ${label}`);
  const sizes = (revision.summary?.sizes ?? []).map((s) => ({ name: s.name, rounds: s.rounds.length }));
  return { pattern, release, revision, sizes };
}

function sizeOf(ctx: ReleaseContext, size: string | undefined): { name: string; rounds: number } {
  if (size === undefined || size === '') {
    if (ctx.sizes.length === 1) return ctx.sizes[0]!;
    throw badRequest('size-required', `Choose a size: ${ctx.sizes.map((s) => s.name).join(', ')}.`);
  }
  const found = ctx.sizes.find((s) => s.name === size);
  if (!found) throw badRequest('unknown-size', `Release ${ctx.release.label} has no size "${size}"; its sizes are ${ctx.sizes.map((s) => s.name).join(', ') || 'none'}.`);
  return found;
}

const toApiProgress = (ctx: ReleaseContext, size: { name: string; rounds: number }, p: KnittingProgress | null): ApiProgress => ({
  release: ctx.release.label,
  revision: ctx.release.revisionNumber,
  size: size.name,
  rounds: size.rounds,
  roundsDone: p?.roundsDone ?? [],
  currentRound: p?.currentRound ?? null,
  updatedAt: p ? p.updatedAt.toISOString() : null,
});

/** The caller's progress in release `label` for `size` (empty when none saved yet). */
export async function getProgress(user: User | null, patternId: number, label: string, size: string | undefined): Promise<ApiProgress> {
  const ctx = await openRelease(user, patternId, label, 'track-progress');
  const s = sizeOf(ctx, size);
  const p = await KnittingProgress.findOne({ where: { userId: (user as User).id, releaseId: ctx.release.id, size: s.name } });
  return toApiProgress(ctx, s, p);
}

/**
 * Saves the caller's progress (replaces what was saved for that release and
 * size). Rounds must lie within the size's rounds; duplicates are dropped and
 * the list sorted. 400 `round-out-of-range` otherwise.
 */
export async function saveProgress(ctx: ServerContext, user: User | null, patternId: number, label: string, size: string | undefined, body: { roundsDone: number[]; currentRound: number | null }): Promise<ApiProgress> {
  const rc = await openRelease(user, patternId, label, 'track-progress');
  const s = sizeOf(rc, size);
  const bad = [...body.roundsDone, ...(body.currentRound === null ? [] : [body.currentRound])].find((n) => n > s.rounds);
  if (bad !== undefined) throw badRequest('round-out-of-range', `Size ${s.name} has ${s.rounds} rounds; there is no round ${bad}.`);
  const roundsDone = [...new Set(body.roundsDone)].sort((a, b) => a - b);
  const userId = (user as User).id;
  const saved = await ctx.sequelize.transaction(async (t) => {
    const existing = await KnittingProgress.findOne({ where: { userId, releaseId: rc.release.id, size: s.name }, transaction: t, lock: t.LOCK.UPDATE });
    if (existing) {
      existing.roundsDone = roundsDone;
      existing.currentRound = body.currentRound;
      existing.changed('updatedAt', true);
      return existing.save({ transaction: t });
    }
    return KnittingProgress.create({ userId, releaseId: rc.release.id, size: s.name, roundsDone, currentRound: body.currentRound }, { transaction: t });
  });
  return toApiProgress(rc, s, saved);
}

/**
 * Reports an erratum on `round` of release `label` (knitters, test knitters,
 * editors). It becomes a comment of kind `erratum` on the released revision,
 * and the designer gets a mail. 400 when the round or size does not exist.
 */
export async function reportErratum(ctx: ServerContext, user: User | null, patternId: number, label: string, body: { round: number; size?: string; body: string }): Promise<{ comment: ApiComment; delivered: boolean }> {
  const rc = await openRelease(user, patternId, label, 'report-erratum');
  const size = body.size !== undefined ? sizeOf(rc, body.size) : null;
  const most = size ? size.rounds : Math.max(0, ...rc.sizes.map((s) => s.rounds));
  if (body.round > most) throw badRequest('round-out-of-range', `${size ? `Size ${size.name}` : `Release ${label}`} has ${most} rounds; there is no round ${body.round}.`);
  const reporter = user as User;
  const comment = await Comment.create({ revisionId: rc.revision.id, authorId: reporter.id, round: body.round, size: size?.name ?? null, kind: 'erratum', body: body.body });
  comment.author = reporter;
  const { pattern } = rc;
  const owner = await User.findByPk(pattern.ownerId);
  let delivered = true;
  if (owner) {
    try {
      await ctx.mailer.send(erratumMail({
        to: owner.email, patternTitle: pattern.title, link: `${ctx.config.publicUrl}/patterns/${pattern.id}?revision=${rc.revision.number}&comment=${comment.id}`,
        reporter: reporter.name, label, round: body.round, size: size?.name ?? null, body: body.body,
      }));
    } catch (err) {
      delivered = false;
      console.error('erratum mail could not be sent:', err instanceof Error ? err.message : err);
    }
  }
  return { comment: toApiComment(comment, rc.revision.number), delivered };
}
