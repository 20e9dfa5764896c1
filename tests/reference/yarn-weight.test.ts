// Reference checks for shared/measure/yarn-weight.ts against the Craft Yarn
// Council Standard Yarn Weight System as listed in ../shared/references.md
// ("Standards": knit gauge in stockinette per 4 in, needle sizes, the revision
// with 7 Jumbo). Per-10 cm gauges are converted with convert-units as oracle.
import convert from 'convert-units';
import { describe, expect, it } from 'vitest';
import { YARN_WEIGHTS, classifyStitchesPer4In, classifyYarnWeight, normalizeGauge } from '../../shared/measure';

// [number, name, min sts, max sts, needle min mm, needle max mm] as references.md gives them.
const CYC: [number, string, number, number, number, number | null][] = [
  [0, 'Lace', 33, 40, 1.5, 2.25],
  [1, 'Super Fine', 27, 32, 2.25, 3.25],
  [2, 'Fine', 23, 26, 3.25, 3.75],
  [3, 'Light', 21, 24, 3.75, 4.5],
  [4, 'Medium', 16, 20, 4.5, 5.5],
  [5, 'Bulky', 12, 15, 5.5, 8],
  [6, 'Super Bulky', 7, 11, 8, 12.75],
];

describe('Craft Yarn Council Standard Yarn Weight System (references.md, Standards)', () => {
  it.each(CYC)('category %i %s: %i-%i sts per 4 in, needles %s-%s mm', (number, name, min, max, needleMin, needleMax) => {
    const c = YARN_WEIGHTS.find((w) => w.number === number);
    expect(c).toMatchObject({ name, minStitchesPer4In: min, maxStitchesPer4In: max, needleMm: { min: needleMin, max: needleMax } });
    // Both ends and the middle of the range classify into it, and the middle
    // is the best match.
    for (const g of [min, max, (min + max) / 2]) {
      expect(classifyStitchesPer4In(g).matches.map((m) => m.category.number)).toContain(number);
    }
    expect(classifyStitchesPer4In((min + max) / 2).matches[0].category.number).toBe(number);
  });

  it('7 Jumbo: 6 sts and fewer per 4 in, 12.75 mm needles and larger', () => {
    const jumbo = YARN_WEIGHTS.find((w) => w.number === 7);
    expect(jumbo?.needleMm).toEqual({ min: 12.75, max: null });
    for (const g of [1, 3, 6]) expect(classifyStitchesPer4In(g).matches[0].category.name).toBe('Jumbo');
    expect(classifyStitchesPer4In(7).matches[0].category.name).toBe('Super Bulky');
  });

  it('0 Lace is marked "guidelines only" (range hard to determine)', () => {
    const lace = classifyStitchesPer4In(36);
    expect(lace.matches[0].category.name).toBe('Lace');
    expect(lace.isGuidelinesOnly).toBe(true);
    expect(lace.message).toContain('guidelines only');
    expect(classifyStitchesPer4In(18).isGuidelinesOnly).toBe(false);
  });

  it('23-24 sts lie in both 2 Fine (23-26) and 3 Light (21-24): both returned, closest middle first', () => {
    expect(classifyStitchesPer4In(23).matches.map((m) => m.category.name)).toEqual(['Light', 'Fine']);
    expect(classifyStitchesPer4In(24).matches.map((m) => m.category.name)).toEqual(['Fine', 'Light']);
    expect(classifyStitchesPer4In(22).matches.map((m) => m.category.name)).toEqual(['Light']);
    expect(classifyStitchesPer4In(25).matches.map((m) => m.category.name)).toEqual(['Fine']);
  });

  it('a gauge between whole-number ranges is outside all of them, with both neighbours', () => {
    const c = classifyStitchesPer4In(15.5);
    expect(c.isOutsideAllRanges).toBe(true);
    expect(c.matches).toEqual([]);
    expect(c.neighbours.map((n) => n.category.name).sort()).toEqual(['Bulky', 'Medium']);
    expect(c.message).toMatch(/outside every yarn weight range/);
    expect(classifyStitchesPer4In(44).neighbours.map((n) => n.category.name)).toEqual(['Lace']);
  });
});

describe('a gauge per 10 cm is converted to per 4 in exactly before classifying (references.md, Unit definition)', () => {
  it.each([
    [22, 'Light'],
    [28, 'Super Fine'],
    [18, 'Medium'],
    [13, 'Bulky'],
  ])('%i sts per 10 cm', (per10, name) => {
    const expectedPer4In = per10 * (convert(4).from('in').to('cm') / 10);
    const c = classifyYarnWeight({ stitches: per10, rows: 30, per: '10cm' });
    expect(c.stitchesPer4In).toBeCloseTo(expectedPer4In, 5);
    expect(c.matches[0].category.name).toBe(name);
  });

  it('24 sts per 10 cm is 24.38 sts per 4 in: Fine only, past the top of Light (not both, as the 2.5 ratio would say)', () => {
    const c = classifyYarnWeight(normalizeGauge({ stitches: 24, rows: 32, per: '10cm' }));
    expect(c.stitchesPer4In).toBeCloseTo(24 * (convert(4).from('in').to('cm') / 10), 5);
    expect(c.matches.map((m) => m.category.name)).toEqual(['Fine']);
  });
});
