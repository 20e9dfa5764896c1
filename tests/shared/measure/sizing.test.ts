// Edge cases and properties of shared/measure/sizing.ts.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { EASE_CATEGORIES, compareToBody, easeCategory, finishedSize, gaugeFromPerInch, suitableWearers } from '../../../shared/measure';

const ORDER = EASE_CATEGORIES.map((c) => c.category);

describe('ease categories', () => {
  it('more ease never gives a tighter category (monotonic, property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -20, max: 20, noNaN: true }), fc.double({ min: -20, max: 20, noNaN: true }), (a, b) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        expect(ORDER.indexOf(easeCategory(lo))).toBeLessThanOrEqual(ORDER.indexOf(easeCategory(hi)));
      }),
    );
  });

  it('treats float noise at a boundary as the boundary (2 in from cm arithmetic)', () => {
    expect(easeCategory(5.08 / 2.54)).toBe('standard');
    expect(easeCategory(1.9999999999999998)).toBe('standard');
    expect(easeCategory(Number.POSITIVE_INFINITY)).toBe('oversized');
  });
});

describe('finished size', () => {
  it('flat pieces report a width; more stitches are never narrower (property)', () => {
    const g = gaugeFromPerInch(5, 7);
    expect(finishedSize({ frontStitches: 50, rows: 70, construction: 'flat' }, g)).toEqual({
      widthKind: 'width',
      width: { cm: 25.4, in: 10 },
      length: { cm: 25.4, in: 10 },
    });
    fc.assert(
      fc.property(fc.nat(2000), fc.nat(2000), (a, b) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        const w = (n: number) => finishedSize({ frontStitches: n, rows: 1, construction: 'round' }, g).width.cm;
        expect(w(lo)).toBeLessThanOrEqual(w(hi));
      }),
    );
  });
});

describe('comparison with the body', () => {
  it('reports ease at both ends of the body range and a message with the numbers', () => {
    const c = compareToBody({ value: 7, unit: 'in' }, 'hand', 'woman');
    expect(c?.ease.atMin.in).toBeCloseTo(1, 9);
    expect(c?.ease.atMax.in).toBeCloseTo(-0.5, 9);
    expect(c?.isWithinHatGuidance).toBeNull();
    expect(c?.message).toBe('7 in finished against a woman hand circumference around the knuckles, without the thumb of 6–7.5 in: +0.3 in of ease at the middle (+3.7 %), very close.');
  });

  it('hand wearers at a shared boundary: 7.5 in suits a woman and a man', () => {
    expect(suitableWearers({ cm: 7.5 * 2.54, in: 7.5 }, 'hand')).toEqual(['woman', 'man']);
    expect(suitableWearers({ value: 12, unit: 'in' }, 'hand')).toEqual([]);
  });
});
