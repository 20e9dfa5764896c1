// Reference checks for shared/measure/units.ts against ../shared/references.md
// ("Standards: Unit definition" and "Stitches per inch") and against the
// general-purpose units library convert-units.
import convert from 'convert-units';
import { describe, expect, it } from 'vitest';
import {
  CM_PER_INCH,
  GAUGE_BASIS_CM,
  lengthToStitches,
  normalizeGauge,
  stitchesToLength,
  toCm,
  toInches,
} from '../../shared/measure';

// convert-units 2.x converts metric to imperial through a 3.28084 ft/m
// ratio (6 significant digits), so it agrees with the exact 2.54 to about
// 1e-7 relative: compare relative to 1e-6, not more.
function expectMatchesOracle(actual: number, oracle: number): void {
  expect(Math.abs(actual - oracle)).toBeLessThanOrEqual(Math.abs(oracle) * 1e-6);
}

describe('unit definition: 1 in = 2.54 cm exactly (references.md, Standards: international inch)', () => {
  it('our constant is exactly 2.54', () => {
    expect(CM_PER_INCH).toBe(2.54);
    expect(toCm({ value: 1, unit: 'in' })).toBe(2.54);
  });

  it.each([0.5, 1, 4, 7.25, 21, 23, 100])('%s in agrees with convert-units (oracle)', (inches) => {
    expectMatchesOracle(toCm({ value: inches, unit: 'in' }), convert(inches).from('in').to('cm'));
  });

  it.each([2.5, 10, 10.16, 53.34, 152.4])('%s cm agrees with convert-units (oracle)', (cm) => {
    expectMatchesOracle(toInches({ value: cm, unit: 'cm' }), convert(cm).from('cm').to('in'));
  });
});

describe('gauge basis: per 4 in is 10.16 cm, not 10 cm (references.md, Unit definition: say which convention, be consistent)', () => {
  it('4 in is 10.16 cm according to convert-units (oracle) and our basis table', () => {
    expectMatchesOracle(GAUGE_BASIS_CM['4in'], convert(4).from('in').to('cm'));
    expect(GAUGE_BASIS_CM['10cm']).toBe(10);
  });

  it('22 sts per 4 in and 22 sts per 10 cm are different gauges, 1.6 % apart (exact conversion, not the 2.5 ratio)', () => {
    const per4in = normalizeGauge({ stitches: 22, rows: 30, per: '4in' });
    const per10cm = normalizeGauge({ stitches: 22, rows: 30, per: '10cm' });
    expect(per10cm.stitchesPerCm / per4in.stitchesPerCm).toBeCloseTo(10.16 / 10, 12);
    expectMatchesOracle(per4in.stitchesPer10Cm, 22 * 10 / convert(4).from('in').to('cm'));
  });

  it('a gauge per 10 cm in stitches per inch agrees with convert-units (oracle)', () => {
    const g = normalizeGauge({ stitches: 28, rows: 36, per: '10cm' });
    // 28 stitches span 10 cm; one inch holds 28 x (1 in in cm) / 10.
    expectMatchesOracle(g.stitchesPerInch, (28 * convert(1).from('in').to('cm')) / 10);
    expectMatchesOracle(g.rowsPerInch, (36 * convert(1).from('in').to('cm')) / 10);
  });
});

describe('stitches per inch = stitches per 4 in / 4 (references.md, Standards)', () => {
  it('22 sts per 4 in = 5.5 sts per in (references.md worked value)', () => {
    const g = normalizeGauge({ stitches: 22, rows: 28, per: '4in' });
    expect(g.stitchesPerInch).toBe(5.5);
    expect(g.rowsPerInch).toBe(7);
  });

  it('22 sts at 22 sts per 4 in measure 4 in, which convert-units puts at 10.16 cm (oracle)', () => {
    const g = normalizeGauge({ stitches: 22, rows: 28, per: '4in' });
    const width = stitchesToLength(22, g);
    expect(width.in).toBe(4);
    expectMatchesOracle(width.cm, convert(4).from('in').to('cm'));
    expect(lengthToStitches({ value: 4, unit: 'in' }, g)).toBe(22);
  });
});
