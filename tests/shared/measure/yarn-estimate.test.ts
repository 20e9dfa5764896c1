// Edge cases and properties of shared/measure/yarn-estimate.ts.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_YARN_ALLOWANCE,
  LOOP_COURSE_CONSTANT,
  LOOP_WALE_CONSTANT,
  calibrateFromSwatch,
  estimateYarn,
  modelStitchLength,
  normalizeGauge,
} from '../../../shared/measure';

const gauge = normalizeGauge({ stitches: 28, rows: 36, per: '10cm' });

describe('model stitch length', () => {
  it('is the geometric mean of 3.8 / sts per cm and 5.0 / rows per cm', () => {
    const model = modelStitchLength(gauge);
    expect(model.basis).toBe('model');
    expect(model.cmPerStitch).toBeCloseTo(Math.sqrt((LOOP_WALE_CONSTANT / 2.8) * (LOOP_COURSE_CONSTANT / 3.6)), 12);
    expect(model.cmPerStitch).toBeCloseTo(1.3729, 3);
  });

  it('finer gauges use less yarn per stitch (monotonic, property)', () => {
    fc.assert(
      fc.property(fc.double({ min: 5, max: 50, noNaN: true }), fc.double({ min: 0.1, max: 10, noNaN: true }), (sts, more) => {
        const coarse = modelStitchLength(normalizeGauge({ stitches: sts, rows: sts * 1.3, per: '10cm' }));
        const fine = modelStitchLength(normalizeGauge({ stitches: sts + more, rows: (sts + more) * 1.3, per: '10cm' }));
        expect(fine.cmPerStitch).toBeLessThan(coarse.cmPerStitch);
      }),
    );
  });
});

describe('swatch calibration', () => {
  it('round-trips: estimating the swatch\'s own stitches gives its yarn back (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10000 }), fc.double({ min: 0.5, max: 500, noNaN: true }), (stitches, metres) => {
        const cal = calibrateFromSwatch({ stitches, yarnLength: { value: metres * 100, unit: 'cm' } });
        if (!cal.ok) throw new Error(cal.problem.message);
        const est = estimateYarn([{ yarn: 'A', stitches }], gauge, { stitchLength: cal.value, allowance: 0 });
        if (!est.ok) throw new Error(est.problem.message);
        expect(est.value.amounts[0].metres).toBeCloseTo(metres, 6);
        expect(est.value.model.basis).toBe('swatch');
      }),
    );
  });

  it.each([
    [{ stitches: 0, yarnLength: { value: 10, unit: 'cm' as const } }, 'swatch-stitches'],
    [{ stitches: 10.5, yarnLength: { value: 10, unit: 'cm' as const } }, 'swatch-stitches'],
    [{ stitches: 100, yarnLength: { value: -1, unit: 'in' as const } }, 'swatch-length'],
    [{ stitches: 100, weightGrams: 0, metresPer100g: 200 }, 'swatch-weight'],
    [{ stitches: 100, weightGrams: 5, metresPer100g: Number.NaN }, 'swatch-weight'],
  ])('refuses %o with %s', (swatch, code) => {
    const outcome = calibrateFromSwatch(swatch);
    expect(!outcome.ok && outcome.problem.code).toBe(code);
  });
});

describe('estimateYarn', () => {
  it('adds floats at one stitch width each and the allowance on top', () => {
    const outcome = estimateYarn([{ yarn: 'B', stitches: 1000, floatStitches: 280, metresPer100g: 400 }], gauge);
    if (!outcome.ok) throw new Error(outcome.problem.message);
    const a = outcome.value.amounts[0];
    const expectedCm = 1000 * modelStitchLength(gauge).cmPerStitch + 280 / 2.8;
    expect(a.metres).toBeCloseTo(expectedCm / 100, 9);
    expect(a.metresWithAllowance).toBeCloseTo((expectedCm / 100) * (1 + DEFAULT_YARN_ALLOWANCE), 9);
    expect(a.gramsWithAllowance).toBeCloseTo((a.metresWithAllowance / 400) * 100, 9);
    expect(outcome.value.totalMetresWithAllowance).toBe(a.metresWithAllowance);
  });

  it('more stitches never need less yarn (monotonic, property)', () => {
    fc.assert(
      fc.property(fc.nat(100000), fc.nat(100000), fc.nat(5000), (a, b, floats) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        const est = estimateYarn(
          [
            { yarn: 'lo', stitches: lo, floatStitches: floats },
            { yarn: 'hi', stitches: hi, floatStitches: floats },
          ],
          gauge,
        );
        if (!est.ok) throw new Error(est.problem.message);
        expect(est.value.amounts[0].metres).toBeLessThanOrEqual(est.value.amounts[1].metres);
      }),
    );
  });

  it('refuses fractional or negative counts and a negative allowance', () => {
    expect(estimateYarn([{ yarn: 'A', stitches: 1.5 }], gauge).ok).toBe(false);
    expect(estimateYarn([{ yarn: 'A', stitches: 10, floatStitches: -1 }], gauge).ok).toBe(false);
    const neg = estimateYarn([{ yarn: 'A', stitches: 10 }], gauge, { allowance: -0.1 });
    expect(!neg.ok && neg.problem.code).toBe('yarn-allowance');
  });

  it('an empty list is a zero estimate, not an error', () => {
    const outcome = estimateYarn([], gauge);
    expect(outcome.ok && outcome.value.totalMetresWithAllowance).toBe(0);
  });
});
