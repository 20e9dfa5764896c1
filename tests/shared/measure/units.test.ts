// Edge cases and properties of shared/measure/units.ts.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  floatLimitInStitches,
  formatGauge,
  formatLength,
  gaugeFromPerInch,
  lengthToRows,
  lengthToStitches,
  normalizeGauge,
  rowsToLength,
  stitchesToLength,
  tryNormalizeGauge,
  type GaugeBasis,
} from '../../../shared/measure';

const basis = fc.constantFrom<GaugeBasis>('10cm', '4in');
const gaugeNumber = fc.double({ min: 1, max: 80, noNaN: true });
const declaration = fc.record({ stitches: gaugeNumber, rows: gaugeNumber, per: basis });

describe('gauge normalisation', () => {
  it.each([
    [{ stitches: 0, rows: 30, per: '10cm' }, 'gauge-stitches'],
    [{ stitches: -4, rows: 30, per: '4in' }, 'gauge-stitches'],
    [{ stitches: 22, rows: Number.NaN, per: '4in' }, 'gauge-rows'],
    [{ stitches: 22, rows: Number.POSITIVE_INFINITY, per: '4in' }, 'gauge-rows'],
    [{ stitches: 22, rows: 30, per: '5cm' }, 'gauge-basis'],
  ])('refuses %o with %s and does not throw', (decl, code) => {
    const outcome = tryNormalizeGauge(decl as never);
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) expect(outcome.problem.code).toBe(code);
    expect(() => normalizeGauge(decl as never)).toThrow(RangeError);
  });

  it('never throws on any numbers (property)', () => {
    fc.assert(
      fc.property(fc.double(), fc.double(), basis, (stitches, rows, per) => {
        const outcome = tryNormalizeGauge({ stitches, rows, per });
        expect(outcome.ok).toBe(stitches > 0 && rows > 0 && Number.isFinite(stitches) && Number.isFinite(rows));
      }),
    );
  });

  it('keeps its invariants between units (property)', () => {
    fc.assert(
      fc.property(declaration, (decl) => {
        const g = normalizeGauge(decl);
        expect(g.stitchesPerInch).toBeCloseTo(g.stitchesPerCm * 2.54, 9);
        expect(g.rowsPerInch).toBeCloseTo(g.rowsPerCm * 2.54, 9);
        expect(g.stitchesPer4In).toBeCloseTo(g.stitchesPerInch * 4, 9);
        expect(g.stitchesPer10Cm).toBeCloseTo(g.stitchesPerCm * 10, 9);
        expect(g.rowsPer4In).toBeCloseTo(g.rowsPerInch * 4, 9);
        expect(g.rowsPer10Cm).toBeCloseTo(g.rowsPerCm * 10, 9);
        // The declared number comes back unchanged on its own basis.
        expect(decl.per === '4in' ? g.stitchesPer4In : g.stitchesPer10Cm).toBe(decl.stitches);
      }),
    );
  });

  it('formats a gauge in the declared basis with per-inch values', () => {
    expect(formatGauge(normalizeGauge({ stitches: 22, rows: 30, per: '10cm' }))).toBe(
      '22 sts and 30 rows per 10 cm (5.59 sts and 7.62 rows per in)',
    );
    expect(formatGauge(normalizeGauge({ stitches: 28, rows: 36, per: '4in' }))).toBe(
      '28 sts and 36 rows per 4 in (7 sts and 9 rows per in)',
    );
  });
});

describe('lengths from counts and back', () => {
  it('stitch counts round-trip through lengths exactly for whole numbers (property)', () => {
    fc.assert(
      fc.property(declaration, fc.integer({ min: 0, max: 5000 }), fc.constantFrom('in', 'cm'), (decl, n, unit) => {
        const g = normalizeGauge(decl);
        const len = stitchesToLength(n, g);
        expect(lengthToStitches({ value: len[unit as 'in' | 'cm'], unit: unit as 'in' | 'cm' }, g)).toBe(n);
        const height = rowsToLength(n, g);
        expect(lengthToRows({ value: height.cm, unit: 'cm' }, g, 'nearest')).toBe(n);
      }),
    );
  });

  it('more stitches are never shorter (monotonic, property)', () => {
    fc.assert(
      fc.property(declaration, fc.nat(10000), fc.nat(10000), (decl, a, b) => {
        const g = normalizeGauge(decl);
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        expect(stitchesToLength(lo, g).cm).toBeLessThanOrEqual(stitchesToLength(hi, g).cm);
      }),
    );
  });

  it('rounds counts as asked', () => {
    const g = gaugeFromPerInch(5.5, 7);
    expect(lengthToStitches({ value: 3, unit: 'in' }, g)).toBe(16.5);
    expect(lengthToStitches({ value: 3, unit: 'in' }, g, 'down')).toBe(16);
    expect(lengthToStitches({ value: 3, unit: 'in' }, g, 'up')).toBe(17);
    expect(lengthToStitches({ value: 3, unit: 'in' }, g, 'nearest')).toBe(17);
  });
});

describe('float limit in stitches', () => {
  it('is the longest float within the limit: n fits, n + 1 does not (property)', () => {
    fc.assert(
      fc.property(declaration, fc.double({ min: 0, max: 20, noNaN: true }), fc.constantFrom('in', 'cm'), (decl, value, unit) => {
        const g = normalizeGauge(decl);
        const limit = { value, unit: unit as 'in' | 'cm' };
        const n = floatLimitInStitches(limit, g);
        const key = limit.unit;
        expect(stitchesToLength(n, g)[key]).toBeLessThanOrEqual(value + 1e-9);
        expect(stitchesToLength(n + 1, g)[key]).toBeGreaterThan(value - 1e-9);
      }),
    );
  });

  it('counts a float of exactly the limit as within it despite float rounding', () => {
    // 10 cm of 28 sts per 4 in: 27.559... sts; 4 in of the same: exactly 28.
    const g = normalizeGauge({ stitches: 28, rows: 36, per: '4in' });
    expect(floatLimitInStitches({ value: 10.16, unit: 'cm' }, g)).toBe(28);
    expect(floatLimitInStitches({ value: 10, unit: 'cm' }, g)).toBe(27);
  });

  it('refuses a negative or NaN limit (programmer error); an infinite limit means no limit', () => {
    const g = gaugeFromPerInch(7, 9);
    expect(() => floatLimitInStitches({ value: -1, unit: 'in' }, g)).toThrow(RangeError);
    expect(() => floatLimitInStitches({ value: Number.NaN, unit: 'cm' }, g)).toThrow(RangeError);
    expect(floatLimitInStitches({ value: 0, unit: 'in' }, g)).toBe(0);
    expect(floatLimitInStitches({ value: Number.POSITIVE_INFINITY, unit: 'cm' }, g)).toBe(Number.POSITIVE_INFINITY);
  });
});

describe('formatLength', () => {
  it('prints both units, trims zeros, honours options', () => {
    expect(formatLength({ value: 10, unit: 'in' })).toBe('25.4 cm (10 in)');
    expect(formatLength({ cm: 50.8, in: 20 }, { unit: 'in' })).toBe('20 in');
    expect(formatLength({ value: 53.34, unit: 'cm' }, { unit: 'cm' })).toBe('53.3 cm');
    expect(formatLength({ value: 1, unit: 'in' }, { primary: 'in', cmDigits: 2 })).toBe('1 in (2.54 cm)');
    expect(formatLength({ value: 0.04, unit: 'in' }, { unit: 'in' })).toBe('0 in');
    expect(formatLength({ value: -0.01, unit: 'cm' }, { unit: 'cm' })).toBe('0 cm');
  });
});
