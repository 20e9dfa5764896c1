// Reference checks for the float rule of thumb (references.md, "Floats and
// backing stitches"): catch a float longer than about 1 in (2.5 cm); at about
// 7 sts/in a catch every 5-6 sts keeps floats under an inch. Common practice,
// no standard. Lengths cross-checked with convert-units.
import convert from 'convert-units';
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_FLOAT_LIMIT,
  floatLimitInStitches,
  gaugeFromPerInch,
  isFloatWithinLimit,
  stitchesToLength,
} from '../../shared/measure';

const fingering = gaugeFromPerInch(7, 9);

describe('float limit rule of thumb (references.md Floats; common practice)', () => {
  it('the default float limit is 1 in (about 2.5 cm) (references.md; notation.md header default)', () => {
    expect(DEFAULT_FLOAT_LIMIT).toEqual({ value: 1, unit: 'in' });
    expect(convert(DEFAULT_FLOAT_LIMIT.value).from('in').to('cm')).toBeCloseTo(2.5, 1);
  });

  it.each([5, 6])('at 7 sts/in a float caught every %i sts stays under an inch (common practice)', (every) => {
    const length = stitchesToLength(every, fingering);
    expect(length.in).toBeLessThan(1);
    expect(length.cm).toBeLessThan(convert(1).from('in').to('cm'));
    expect(isFloatWithinLimit(every, DEFAULT_FLOAT_LIMIT, fingering)).toBe(true);
  });

  it('at 7 sts/in the 1 in limit allows at most 7 sts (exactly 1 in) and 8 sts are over (common practice arithmetic)', () => {
    expect(floatLimitInStitches(DEFAULT_FLOAT_LIMIT, fingering)).toBe(7);
    expect(isFloatWithinLimit(8, DEFAULT_FLOAT_LIMIT, fingering)).toBe(false);
    expect(stitchesToLength(8, fingering).in).toBeGreaterThan(1);
  });

  it('at 7 sts/in the 2.5 cm form of the limit allows 6 sts: "every 5-6 sts" (common practice)', () => {
    expect(floatLimitInStitches({ value: 2.5, unit: 'cm' }, fingering)).toBe(6);
    // 2.5 cm in inches according to convert-units, times 7 sts/in, rounded down.
    expect(Math.floor(convert(2.5).from('cm').to('in') * 7)).toBe(6);
  });

  it('"about 5 stitches" at a typical worsted gauge of 5 sts/in (references.md: several teachers; common practice)', () => {
    expect(floatLimitInStitches(DEFAULT_FLOAT_LIMIT, gaugeFromPerInch(5, 7))).toBe(5);
  });
});
