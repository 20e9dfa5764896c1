// Edge cases and properties of shared/measure/yarn-weight.ts.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { YARN_WEIGHTS, classifyStitchesPer4In, suggestYarnWeight } from '../../../shared/measure';

describe('yarn weight classification', () => {
  it('matches are exactly the ranges holding the gauge, best first (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 60, noNaN: true }), (g) => {
        const c = classifyStitchesPer4In(g);
        const holding = YARN_WEIGHTS.filter((w) => g >= w.minStitchesPer4In && g <= w.maxStitchesPer4In).map((w) => w.number);
        expect(c.matches.map((m) => m.category.number).sort()).toEqual(holding.sort());
        for (let i = 1; i < c.matches.length; i++) {
          expect(c.matches[i - 1].distanceFromMiddle).toBeLessThanOrEqual(c.matches[i].distanceFromMiddle);
        }
        expect(c.isOutsideAllRanges).toBe(holding.length === 0);
        expect(c.neighbours.length > 0).toBe(holding.length === 0);
      }),
    );
  });

  it('finer gauges never suggest a thicker yarn (monotonic, property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 60, noNaN: true }), fc.double({ min: 0.1, max: 60, noNaN: true }), (a, b) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        const gauge = (n: number) => ({ stitches: n, rows: n, per: '4in' as const });
        // Higher category number = thicker yarn = fewer stitches.
        expect(suggestYarnWeight(gauge(lo)).number).toBeGreaterThanOrEqual(suggestYarnWeight(gauge(hi)).number);
      }),
    );
  });

  it('ties between overlapping ranges go to the finer yarn', () => {
    // 23.5 is 1 st from the middle of Light (22.5) and of Fine (24.5).
    expect(classifyStitchesPer4In(23.5).matches.map((m) => m.category.name)).toEqual(['Fine', 'Light']);
  });

  it('names the nearest neighbours in a gap', () => {
    const c = classifyStitchesPer4In(11.2);
    expect(c.neighbours[0].category.name).toBe('Super Bulky');
    expect(c.neighbours[0].distance).toBeCloseTo(0.2, 9);
    expect(c.message).toBe('11.2 sts per 4 in is outside every yarn weight range: between 6 Super Bulky (7–11 sts per 4 in) and 5 Bulky (12–15 sts per 4 in).');
  });

  it.each([0, -3, Number.NaN, Number.POSITIVE_INFINITY])('refuses %s stitches per 4 in (programmer error)', (g) => {
    expect(() => classifyStitchesPer4In(g)).toThrow(RangeError);
  });
});
