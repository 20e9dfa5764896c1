// The round alignment (shared/diff/align.ts) on small key sequences. Oracle
// for "pairs as many rounds as possible": the `diff` package's diffArrays
// (Myers' minimal edit script), whose kept items are a longest common
// subsequence of the shape keys.
import { diffArrays } from 'diff';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { alignRounds, type RoundKeys } from '../../../shared/diff/align';

/** Rounds as "shape.variant": equal shape pairs, equal whole string is identical. */
const keysOf = (rounds: string[]): RoundKeys => ({ exact: rounds, shape: rounds.map((r) => r.split('.')[0]) });
const roundsArb = fc.array(fc.tuple(fc.constantFrom('k', 'inc', 'dec', 'rib'), fc.nat(1)).map(([s, v]) => `${s}.${v}`), { maxLength: 30 });

describe('alignRounds', () => {
  it('shows a round inserted in the middle as one added round, pairing the later rounds with their old selves', () => {
    // An increase inserted after round 3; the later rounds have more stitches (another variant) but the same shape.
    const old = ['rib.0', 'rib.0', 'k.0', 'k.0', 'inc.0', 'k.0', 'k.0'];
    const neu = ['rib.0', 'rib.0', 'k.0', 'inc.0', 'k.1', 'inc.1', 'k.1', 'k.1'];
    expect(alignRounds(keysOf(old), keysOf(neu))).toEqual([
      { o: 0, n: 0 }, { o: 1, n: 1 }, { o: 2, n: 2 }, { o: -1, n: 3 }, { o: 3, n: 4 }, { o: 4, n: 5 }, { o: 5, n: 6 }, { o: 6, n: 7 },
    ]);
  });

  it('visits every round once, in order on both sides', () => {
    fc.assert(fc.property(roundsArb, roundsArb, (a, b) => {
      const steps = alignRounds(keysOf(a), keysOf(b));
      expect(steps.filter((s) => s.o >= 0).map((s) => s.o)).toEqual(a.map((_, i) => i));
      expect(steps.filter((s) => s.n >= 0).map((s) => s.n)).toEqual(b.map((_, i) => i));
    }));
  });

  it('pairs a longest common subsequence of shapes (diffArrays of the diff package as the oracle)', () => {
    fc.assert(fc.property(roundsArb, roundsArb, (a, b) => {
      const ka = keysOf(a), kb = keysOf(b);
      const steps = alignRounds(ka, kb);
      const sameShape = steps.filter((s) => s.o >= 0 && s.n >= 0 && ka.shape[s.o] === kb.shape[s.n]).length;
      const lcs = diffArrays([...ka.shape], [...kb.shape]).filter((c) => !c.added && !c.removed).reduce((t, c) => t + c.count, 0);
      expect(sameShape).toBe(lcs);
    }));
  });

  it('is a mirror image when the sides are swapped', () => {
    fc.assert(fc.property(roundsArb, roundsArb, (a, b) => {
      const ab = alignRounds(keysOf(a), keysOf(b)), ba = alignRounds(keysOf(b), keysOf(a));
      expect(ba).toEqual(ab.map((s) => ({ o: s.n, n: s.o })));
    }));
  });
});
