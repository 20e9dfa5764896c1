import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { compile } from '../../../shared/index.ts';
import { coverCircle, planBacking, stabIntervals, formatPlanText } from '../../../shared/render/index.ts';
import { HEADER } from './helpers.ts';

/** Smallest number of allowed points hitting every interval, by trying every subset (small cases only). */
function bruteForce(intervals: [number, number][], lo: number, hi: number): number {
  const hittable = intervals.filter(([a, b]) => Math.max(a, lo) <= Math.min(b, hi));
  const points = Array.from({ length: hi - lo + 1 }, (_, i) => lo + i);
  let best = Infinity;
  for (let mask = 0; mask < 1 << points.length; mask++) {
    const chosen = points.filter((_, i) => mask & (1 << i));
    if (chosen.length >= best) continue;
    if (hittable.every(([a, b]) => chosen.some((p) => p >= a && p <= b))) best = chosen.length;
  }
  return best;
}

describe('interval cover (the planner\'s core)', () => {
  it('the greedy hits every hittable interval with the fewest points (property, against brute force)', () => {
    const interval = fc.tuple(fc.integer({ min: 0, max: 12 }), fc.integer({ min: 0, max: 5 })).map(([a, len]) => [a, a + len] as [number, number]);
    fc.assert(fc.property(fc.array(interval, { maxLength: 10 }), fc.integer({ min: 0, max: 4 }), fc.integer({ min: 6, max: 12 }), (ivs, lo, hi) => {
      const { points, unhittable } = stabIntervals(ivs, lo, hi);
      const hittable = ivs.filter(([a, b]) => Math.max(a, lo) <= Math.min(b, hi));
      expect(unhittable).toBe(ivs.length - hittable.length);
      expect(points.every((p) => p >= lo && p <= hi)).toBe(true);
      for (const [a, b] of hittable) expect(points.some((p) => p >= a && p <= b)).toBe(true);
      expect(points.length).toBe(bruteForce(ivs, lo, hi));
    }), { numRuns: 200, seed: 4 });
  });
});

describe('circle cover (floats across the start of the round)', () => {
  it('hits every cyclic interval with the fewest boundaries, never at the start of the round (property, against brute force)', () => {
    const n = 11;
    const holds = (iv: [number, number], p: number) => (p >= iv[0] && p <= iv[1]) || (p + n >= iv[0] && p + n <= iv[1]);
    const interval = fc.tuple(fc.integer({ min: 0, max: n - 1 }), fc.integer({ min: 1, max: 4 })).map(([a, len]) => [a, a + len] as [number, number]);
    fc.assert(fc.property(fc.array(interval, { minLength: 1, maxLength: 8 }), (ivs) => {
      // Only intervals that hold some allowed boundary are posed.
      const posed = ivs.filter((iv) => Array.from({ length: n - 1 }, (_, i) => i + 1).some((p) => holds(iv, p)));
      const points = coverCircle(posed, n);
      expect(points.every((p) => p >= 1 && p <= n - 1)).toBe(true);
      for (const iv of posed) expect(points.some((p) => holds(iv, p))).toBe(true);
      let best = Infinity;
      for (let mask = 0; mask < 1 << (n - 1); mask++) {
        const chosen = Array.from({ length: n - 1 }, (_, i) => i + 1).filter((_, i) => mask & (1 << i));
        if (chosen.length < best && posed.every((iv) => chosen.some((p) => holds(iv, p)))) best = chosen.length;
      }
      expect(points.length).toBe(posed.length ? best : 0);
    }), { numRuns: 150, seed: 9 });
  });
});

describe('backing-stitch planner', () => {
  const longFloats = `${HEADER}\nsizes S M\ncast on 40/48 in A\nrounds 1-3: (k 9/11 in A, k 1 in B) to end\nround 4: k to end`;

  it('proposes ladder columns that remove every long float, proved by compiling the patched source', () => {
    expect(compile(longFloats).diagnostics.some((d) => d.code === 'LW501')).toBe(true);
    const plan = planBacking({ source: longFloats, first: 1, last: 3 });
    expect(plan.ok).toBe(true);
    expect(plan.before.length).toBeGreaterThan(0);
    expect(plan.after).toEqual([]);
    expect(plan.ladderSource).toMatch(/^ladder B columns [\d/, ]+ from round 1 to 4$/);
    const patched = compile(plan.patchedSource);
    expect(patched.ok).toBe(true);
    for (const s of patched.sizes) for (const r of s.rounds.slice(0, 3)) expect(r.longestFloat!.stitches).toBeLessThanOrEqual(7);
    // One column per run of 9 (or 11) A stitches: 4 columns each, the fewest possible.
    expect(plan.sizes.map((p) => p.columns.length)).toEqual([4, 4]);
    expect(formatPlanText(plan)).toContain('proof: the patched source compiles');
  });

  it('finds the optimum when floats cross the start of the round (two columns per 19-stitch float)', () => {
    const src = `${HEADER}\ncast on 40 in A\nrounds 1-2: k 9 in A, k 1 in B, k 19 in A, k 1 in B, k 10 in A\nround 3: k to end`;
    const plan = planBacking({ source: src, first: 1, last: 2 });
    expect(plan.ok).toBe(true);
    expect(plan.sizes[0].columns.length).toBe(4);
  });

  it('carries a yarn that is absent from some rounds with columns at most the limit apart', () => {
    const src = `${HEADER}\ncast on 40 in A\nround 1: (k 9 in A, k 1 in B) to end\nrounds 2-4: k to end in A\nround 5: (k 9 in A, k 1 in B) to end\nround 6: k to end`;
    const plan = planBacking({ source: src, first: 1, last: 5 });
    expect(plan.ok).toBe(true);
    // 40 stitches around with floats of at most 7: at least 6 columns (5 x 7 = 35 < 40).
    expect(plan.sizes[0].columns.length).toBe(6);
  });

  it('keeps the columns inside a segment', () => {
    const src = `${HEADER}\ncast on 40 in A\nround 1: mark back, k 20, mark palm, k to end\nrounds 2-4 at back: (k 9 in A, k 1 in B) to end\nrounds 2-4 at palm: (k1 in A, k1 in B) to end\nround 5: k to end`;
    const plan = planBacking({ source: src, first: 2, last: 4, segment: 'back' });
    expect(plan.ok).toBe(true);
    expect(plan.ladderSource).toMatch(/ at back$/);
    expect(plan.sizes[0].columns.every((c) => c > 0 && c < 20)).toBe(true);
  });

  it('works flat, with columns set up on the range\'s first row', () => {
    const src = `${HEADER.replace('rounds', 'rows')}\nwork flat\ncast on 30 in A\nrows 1-4: (k 9 in A, k 1 in B) to end\nrow 5: k to end`;
    const plan = planBacking({ source: src, first: 1, last: 4 });
    expect(plan.ok).toBe(true);
    expect(plan.ladderSource).toMatch(/from row 1 to 5$/);
  });

  it('points at an existing ladder over the same rounds instead of claiming a proof', () => {
    const src = `${longFloats}\nladder B every 5 from round 2 to 4`;
    const plan = planBacking({ source: src, first: 1, last: 3 });
    expect(plan.ok).toBe(false);
    expect(plan.problems.join(' ')).toMatch(/already runs over these rounds/);
  });

  it('says so when nothing is needed, and refuses a pattern with errors', () => {
    const fine = planBacking({ source: `${HEADER}\ncast on 8 in A\nrounds 1-2: (k1 in A, k1 in B) to end`, first: 1, last: 2 });
    expect(fine.ok).toBe(true);
    expect(fine.ladderSource).toBe('');
    const broken = planBacking({ source: `${HEADER}\ncast on 8 in A\nround 1: k 9`, first: 1, last: 1 });
    expect(broken.ok).toBe(false);
    expect(broken.problems[0]).toMatch(/errors/);
  });
});
