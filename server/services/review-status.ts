/**
 * The review status machine, in one place. A pattern is in exactly one
 * status; five events move it, each allowed to one pattern role and only
 * from the listed statuses:
 *
 * | event             | who    | from                                        | to                |
 * |-------------------|--------|---------------------------------------------|-------------------|
 * | `submit`          | owner  | draft, changes-requested, approved, released | in-review         |
 * | `withdraw`        | owner  | in-review                                   | draft             |
 * | `approve`         | editor | in-review                                   | approved          |
 * | `request-changes` | editor | in-review                                   | changes-requested |
 * | `release`         | owner  | approved                                    | released          |
 *
 * Invariants kept by the services around it: `approve` records which
 * revision was approved; `release` freezes exactly that revision under a new
 * label and clears the approval, so a further release needs a further
 * review. Pure: no I/O.
 */
import type { PatternStatusName } from '../../shared/api-schemas.ts';
import type { PatternRole } from './access.ts';

/** The events of the machine. */
export const REVIEW_EVENTS = ['submit', 'withdraw', 'approve', 'request-changes', 'release'] as const;
export type ReviewEventName = (typeof REVIEW_EVENTS)[number];

/** One row of the table above. */
export interface Transition { event: ReviewEventName; role: PatternRole; from: readonly PatternStatusName[]; to: PatternStatusName }

/** Every allowed transition (the test walks this table against every status and role). */
export const TRANSITIONS: readonly Transition[] = [
  { event: 'submit', role: 'owner', from: ['draft', 'changes-requested', 'approved', 'released'], to: 'in-review' },
  { event: 'withdraw', role: 'owner', from: ['in-review'], to: 'draft' },
  { event: 'approve', role: 'editor', from: ['in-review'], to: 'approved' },
  { event: 'request-changes', role: 'editor', from: ['in-review'], to: 'changes-requested' },
  { event: 'release', role: 'owner', from: ['approved'], to: 'released' },
];

/** Outcome of {@link nextStatus}: the new status, or why not (`role`: 403; `status`: 409). */
export type TransitionOutcome =
  | { ok: true; to: PatternStatusName }
  | { ok: false; reason: 'role' | 'status'; message: string };

const words: Record<ReviewEventName, string> = {
  submit: 'ask for a review',
  withdraw: 'withdraw the review request',
  approve: 'approve',
  'request-changes': 'ask for changes',
  release: 'release',
};

/** Where `event` by `role` takes a pattern in status `from`. */
export function nextStatus(from: PatternStatusName, event: ReviewEventName, role: PatternRole): TransitionOutcome {
  const t = TRANSITIONS.find((x) => x.event === event);
  if (!t) return { ok: false, reason: 'status', message: `Unknown review step ${event}.` };
  if (t.role !== role) {
    const who = t.role === 'owner' ? 'the designer who owns the pattern' : 'an invited technical editor';
    return { ok: false, reason: 'role', message: `Only ${who} can ${words[event]}.` };
  }
  if (!t.from.includes(from)) {
    return { ok: false, reason: 'status', message: `The pattern is ${from}; you can ${words[event]} only when it is ${t.from.join(' or ')}.` };
  }
  return { ok: true, to: t.to };
}

/**
 * Which event a `POST /status {status}` request means for `role`, or null
 * when no event leads there. An editor's `draft` is read as asking for
 * changes (the older form of that request).
 */
export function eventForTarget(role: PatternRole, target: PatternStatusName): ReviewEventName | null {
  if (role === 'editor') {
    if (target === 'approved') return 'approve';
    if (target === 'changes-requested' || target === 'draft') return 'request-changes';
    return null;
  }
  if (role === 'owner') {
    if (target === 'in-review') return 'submit';
    if (target === 'draft') return 'withdraw';
    if (target === 'released') return 'release';
    return null;
  }
  return null;
}
