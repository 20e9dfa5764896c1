/**
 * The review workflow: ask for a review, withdraw, approve a revision, ask
 * for changes, release the approved revision under a version label. Every
 * step goes through the status machine (review-status.ts), runs in one
 * transaction holding the pattern row, is written to the review log, and
 * sends its mails after the commit (a mail that cannot be handed over does
 * not undo the step; `delivered` says so).
 */
import { UniqueConstraintError, type Transaction } from 'sequelize';
import { RELEASE_LABEL, type ApiPattern, type ApiRelease, type ApiReviewEvent, type PatternStatusName } from '../../shared/api-schemas.ts';
import type { ServerContext } from '../context.ts';
import type { MailMessage } from '../mail/mailer.ts';
import { approvedMail, changesRequestedMail, releasedMail, reviewRequestedMail } from '../mail/review-templates.ts';
import { Membership, Pattern, Release, Revision, ReviewEvent, User } from '../models/index.ts';
import { authorizePattern } from './access.ts';
import { badRequest, conflict, forbidden, notFound } from './errors.ts';
import { toApiPattern } from './patterns.ts';
import { eventForTarget, nextStatus, type ReviewEventName } from './review-status.ts';
import { toPerson } from './serialize.ts';

/** What a step may carry besides the event. */
export interface ReviewStepInput {
  /** Revision submitted, approved or released (defaults: newest; for release, the approved one). */
  revision?: number;
  /** Note with a request, a verdict, or changes asked for. */
  message?: string;
  /** `submit`: the editor asked (must be an invited editor). */
  editorId?: number;
  /** `release`: version label (already checked against RELEASE_LABEL by the route). */
  label?: string;
  /** `release`: release notes. */
  notes?: string;
}

/** Result of a step. */
export interface ReviewStepResult { pattern: ApiPattern; event: ApiReviewEvent; release: ApiRelease | null; delivered: boolean }

/** A release as the API shows it. */
export function toApiRelease(r: Release, releasedBy?: User | null): ApiRelease {
  return { id: r.id, label: r.label, revision: r.revisionNumber, notes: r.notes ?? '', releasedBy: toPerson(releasedBy ?? r.releasedBy), releasedAt: r.createdAt.toISOString() };
}

/** A review log entry as the API shows it. */
export function toApiReviewEvent(e: ReviewEvent): ApiReviewEvent {
  return {
    id: e.id,
    event: e.event,
    from: e.fromStatus as PatternStatusName,
    to: e.toStatus as PatternStatusName,
    revision: e.revisionNumber ?? null,
    actor: toPerson(e.actor),
    editor: e.editor ? toPerson(e.editor) : null,
    message: e.message ?? null,
    createdAt: e.createdAt.toISOString(),
  };
}

/** Compares version labels number by number ("1.10" > "1.9"; "1.0" > "1"). */
export function compareLabels(a: string, b: string): number {
  const pa = a.split('.').map(Number), pb = b.split('.').map(Number);
  for (let i = 0; i < Math.max(pa.length, pb.length); i++) {
    const d = (pa[i] ?? -1) - (pb[i] ?? -1);
    if (d !== 0) return d;
  }
  return 0;
}

async function revisionExists(t: Transaction, patternId: number, number: number): Promise<Revision> {
  const r = await Revision.findOne({ where: { patternId, number }, attributes: ['id', 'number'], transaction: t });
  if (!r) throw notFound(`Revision ${number}`);
  return r;
}

async function editorsOf(patternId: number, t?: Transaction): Promise<User[]> {
  const ms = await Membership.findAll({ where: { patternId, role: 'editor' }, include: [{ model: User, as: 'user' }], transaction: t });
  return ms.map((m) => m.user).filter((u): u is User => Boolean(u));
}

/**
 * Takes review step `event` on pattern `patternId` as `user`. 404 when the
 * user cannot see the pattern, 403 when their role may not take the step,
 * 400 `invalid-status-change` when the pattern's status does not allow it,
 * 404 for an unknown revision, 400 `label-required`, 409 `label-taken`,
 * `label-not-newer`, `not-approved` or `already-released` on release.
 */
export async function takeReviewStep(ctx: ServerContext, user: User | null, patternId: number, event: ReviewEventName, input: ReviewStepInput = {}): Promise<ReviewStepResult> {
  const { pattern: seen, role } = await authorizePattern(user, patternId, 'view');
  const actor = user as User;
  const early = nextStatus(seen.status, event, role);
  if (!early.ok && early.reason === 'role') throw forbidden(early.message);
  if (event === 'release' && !input.label) throw badRequest('label-required', 'Give the release a version label such as 1.0.');
  if (event === 'release' && !RELEASE_LABEL.test(input.label ?? '')) throw badRequest('invalid-label', 'Use a version label such as 1.0 or 1.1 (numbers separated by dots).');

  const mails: MailMessage[] = [];
  const link = `${ctx.config.publicUrl}/patterns/${seen.id}`;
  let result: Omit<ReviewStepResult, 'delivered'>;
  try {
    result = await ctx.sequelize.transaction(async (t) => {
      const pattern = await Pattern.findByPk(seen.id, { transaction: t, lock: t.LOCK.UPDATE });
      if (!pattern) throw notFound('Pattern');
      const from = pattern.status;
      const outcome = nextStatus(from, event, role);
      if (!outcome.ok) throw outcome.reason === 'role' ? forbidden(outcome.message) : badRequest('invalid-status-change', outcome.message);
      const owner = await User.findByPk(pattern.ownerId, { transaction: t });
      let revisionNumber: number | null = null;
      let editor: User | null = null;
      let release: Release | null = null;

      switch (event) {
        case 'submit': {
          revisionNumber = input.revision ?? pattern.latestRevision;
          await revisionExists(t, pattern.id, revisionNumber);
          const editors = await editorsOf(pattern.id, t);
          if (input.editorId !== undefined) {
            editor = editors.find((e) => e.id === input.editorId) ?? null;
            if (!editor) throw badRequest('not-an-editor', 'That person is not an invited technical editor on this pattern; invite them first.');
          }
          pattern.approvedRevision = null;
          for (const e of editor ? [editor] : editors) {
            mails.push(reviewRequestedMail({ to: e.email, patternTitle: pattern.title, link, designer: actor.name, revision: revisionNumber, note: input.message || null }));
          }
          break;
        }
        case 'withdraw':
          break;
        case 'approve': {
          revisionNumber = input.revision ?? pattern.latestRevision;
          await revisionExists(t, pattern.id, revisionNumber);
          if (await Release.findOne({ where: { patternId: pattern.id, revisionNumber }, transaction: t })) {
            throw conflict('already-released', `Revision ${revisionNumber} is already released; approve a newer revision.`);
          }
          pattern.approvedRevision = revisionNumber;
          if (owner) mails.push(approvedMail({ to: owner.email, patternTitle: pattern.title, link, editor: actor.name, revision: revisionNumber, note: input.message || null }));
          break;
        }
        case 'request-changes': {
          revisionNumber = input.revision ?? pattern.latestRevision;
          await revisionExists(t, pattern.id, revisionNumber);
          pattern.approvedRevision = null;
          if (owner) mails.push(changesRequestedMail({ to: owner.email, patternTitle: pattern.title, link, editor: actor.name, revision: revisionNumber, note: input.message || 'No message given.' }));
          break;
        }
        case 'release': {
          const approved = pattern.approvedRevision;
          if (!approved) throw conflict('not-approved', 'No revision is approved; ask an editor to approve one first.');
          if (input.revision !== undefined && input.revision !== approved) {
            throw conflict('not-approved', `Revision ${input.revision} is not the approved one (revision ${approved} is).`);
          }
          const label = input.label as string;
          const earlier = await Release.findAll({ where: { patternId: pattern.id }, attributes: ['label', 'revisionNumber'], transaction: t });
          if (earlier.some((r) => r.label === label)) throw conflict('label-taken', `Version ${label} is already released; choose another label.`);
          const newest = earlier.map((r) => r.label).sort(compareLabels).at(-1);
          if (newest && compareLabels(label, newest) <= 0) throw conflict('label-not-newer', `Version ${label} must come after ${newest}, the newest release.`);
          if (earlier.some((r) => r.revisionNumber === approved)) throw conflict('already-released', `Revision ${approved} is already released.`);
          const revision = await revisionExists(t, pattern.id, approved);
          release = await Release.create({ patternId: pattern.id, revisionId: revision.id, revisionNumber: approved, label, notes: input.notes ?? '', releasedById: actor.id }, { transaction: t });
          revisionNumber = approved;
          pattern.releasedRevision = approved;
          // A release uses up the approval: the next one needs a new review.
          pattern.approvedRevision = null;
          const members = await Membership.findAll({ where: { patternId: pattern.id }, include: [{ model: User, as: 'user' }], transaction: t });
          for (const m of members) {
            if (m.user) mails.push(releasedMail({ to: m.user.email, patternTitle: pattern.title, link: `${link}?release=${encodeURIComponent(label)}`, designer: actor.name, label, notes: input.notes ?? '' }));
          }
          break;
        }
      }
      pattern.status = outcome.to;
      await pattern.save({ transaction: t });
      const logged = await ReviewEvent.create({
        patternId: pattern.id, actorId: actor.id, event, fromStatus: from, toStatus: outcome.to, revisionNumber, editorId: editor?.id ?? null, message: input.message || null,
      }, { transaction: t });
      logged.actor = actor;
      if (editor) logged.editor = editor;
      return { pattern: toApiPattern(pattern, role, owner), event: toApiReviewEvent(logged), release: release ? toApiRelease(release, actor) : null };
    });
  } catch (err) {
    // Two releases racing for one label or revision: the unique index decides; answer like the checks above.
    if (err instanceof UniqueConstraintError) throw conflict('label-taken', 'That version label or revision was released at the same moment; reload and try again.');
    throw err;
  }

  let delivered = true;
  for (const m of mails) {
    try {
      await ctx.mailer.send(m);
    } catch (err) {
      delivered = false;
      console.error(`review mail to ${m.to} could not be sent:`, err instanceof Error ? err.message : err);
    }
  }
  return { ...result, delivered };
}

/** The label after the newest of `labels`: "1.0" when none, else the last number raised by one ("1.1" after "1.0"). */
export function nextLabel(labels: readonly string[]): string {
  const newest = [...labels].sort(compareLabels).at(-1);
  if (!newest) return '1.0';
  const parts = newest.split('.').map(Number);
  parts[parts.length - 1] = (parts.at(-1) ?? 0) + 1;
  return parts.join('.');
}

/**
 * Maps `POST /status {status}` onto a review step; 403 when no step of the
 * caller's role leads there. A release without a label gets the next one
 * ({@link nextLabel}).
 */
export async function changeStatusByTarget(ctx: ServerContext, user: User | null, patternId: number, target: PatternStatusName, input: ReviewStepInput): Promise<ReviewStepResult> {
  const { role } = await authorizePattern(user, patternId, 'view');
  const event = eventForTarget(role, target);
  // Every status is some role's target, so "no step for you" is a permission matter.
  if (!event) throw forbidden(`As ${role === 'editor' ? 'an' : 'a'} ${role} on this pattern you may not set it to ${target}.`);
  if (event === 'release' && !input.label) {
    const labels = (await Release.findAll({ where: { patternId }, attributes: ['label'] })).map((r) => r.label);
    return takeReviewStep(ctx, user, patternId, event, { ...input, label: nextLabel(labels) });
  }
  return takeReviewStep(ctx, user, patternId, event, input);
}

/** The review state and log of a pattern (owner and editors). */
export async function getReview(user: User | null, patternId: number): Promise<{ status: PatternStatusName; approvedRevision: number | null; releasedRevision: number | null; editors: { id: number; name: string }[]; events: ApiReviewEvent[] }> {
  const { pattern } = await authorizePattern(user, patternId, 'view-review');
  const events = await ReviewEvent.findAll({
    where: { patternId: pattern.id },
    include: [{ model: User, as: 'actor' }, { model: User, as: 'editor' }],
    order: [['id', 'ASC']],
  });
  const editors = await editorsOf(pattern.id);
  return {
    status: pattern.status,
    approvedRevision: pattern.approvedRevision ?? null,
    releasedRevision: pattern.releasedRevision ?? null,
    editors: editors.map((e) => toPerson(e)),
    events: events.map(toApiReviewEvent),
  };
}

/** Every release of a pattern, newest first (anyone who can see the pattern). */
export async function listReleases(user: User | null, patternId: number): Promise<ApiRelease[]> {
  const { pattern } = await authorizePattern(user, patternId, 'view');
  const releases = await Release.findAll({ where: { patternId: pattern.id }, include: [{ model: User, as: 'releasedBy' }], order: [['id', 'DESC']] });
  return releases.map((r) => toApiRelease(r));
}
