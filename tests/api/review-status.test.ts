/**
 * The review status machine (server/services/review-status.ts), walked in
 * full: every event, from every status, by every pattern role. The expected
 * table is written out here independently of TRANSITIONS, from the workflow
 * in product.md (the designer asks for and releases, the technical editor
 * approves or asks for changes).
 */
import { describe, expect, it } from 'vitest';
import { PATTERN_STATUSES, type PatternStatusName } from '../../shared/api-schemas.ts';
import type { PatternRole } from '../../server/services/access.ts';
import { eventForTarget, nextStatus, REVIEW_EVENTS, type ReviewEventName } from '../../server/services/review-status.ts';

const ROLES: PatternRole[] = ['owner', 'editor', 'test-knitter', 'knitter'];

// event -> [role allowed, statuses it may start from, status it leads to]
const EXPECTED: Record<ReviewEventName, [PatternRole, PatternStatusName[], PatternStatusName]> = {
  submit: ['owner', ['draft', 'changes-requested', 'approved', 'released'], 'in-review'],
  withdraw: ['owner', ['in-review'], 'draft'],
  approve: ['editor', ['in-review'], 'approved'],
  'request-changes': ['editor', ['in-review'], 'changes-requested'],
  release: ['owner', ['approved'], 'released'],
};

describe('review status machine: every event x status x role', () => {
  for (const event of REVIEW_EVENTS) {
    for (const from of PATTERN_STATUSES) {
      for (const role of ROLES) {
        const [who, froms, to] = EXPECTED[event];
        const allowed = role === who && froms.includes(from);
        it(`${role} ${event} from ${from}: ${allowed ? `-> ${to}` : 'denied'}`, () => {
          const out = nextStatus(from, event, role);
          if (allowed) expect(out).toEqual({ ok: true, to });
          else {
            expect(out.ok).toBe(false);
            // A wrong role is a permission matter (403) whatever the status; a right role in a wrong status is not (400).
            if (!out.ok) expect(out.reason).toBe(role === who ? 'status' : 'role');
          }
        });
      }
    }
  }
});

describe('POST /status targets map onto events', () => {
  it('maps each target for owner and editor, and nothing for knitters', () => {
    expect(eventForTarget('owner', 'in-review')).toBe('submit');
    expect(eventForTarget('owner', 'draft')).toBe('withdraw');
    expect(eventForTarget('owner', 'released')).toBe('release');
    expect(eventForTarget('owner', 'approved')).toBeNull();
    expect(eventForTarget('owner', 'changes-requested')).toBeNull();
    expect(eventForTarget('editor', 'approved')).toBe('approve');
    expect(eventForTarget('editor', 'changes-requested')).toBe('request-changes');
    expect(eventForTarget('editor', 'draft')).toBe('request-changes');
    expect(eventForTarget('editor', 'released')).toBeNull();
    for (const s of PATTERN_STATUSES) {
      expect(eventForTarget('knitter', s)).toBeNull();
      expect(eventForTarget('test-knitter', s)).toBeNull();
    }
  });
});
