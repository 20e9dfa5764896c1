// Reference checks for shared/measure/sizing.ts against ../shared/references.md,
// "Sizing (for finished-size checks; guidance, not standards)": body
// measurements from a size guide that follows the Craft Yarn Council's body
// measurements, the 5-10 % negative ease of hats, and a yarn maker's ease
// categories. Lengths cross-checked with convert-units.
import convert from 'convert-units';
import { describe, expect, it } from 'vitest';
import {
  BODY_MEASUREMENTS,
  compareToBody,
  easeCategory,
  finishedSize,
  normalizeGauge,
  suitableWearers,
  type BodyItem,
  type Wearer,
} from '../../shared/measure';

describe('body measurements (references.md Sizing; size guide following the Craft Yarn Council)', () => {
  it.each([
    ['hat', 'adult', 21, 23],
    ['hat', 'child', 18, 21],
    ['hat', 'toddler', 16, 18],
    ['hat', 'baby', 13, 16],
    ['hand', 'woman', 6, 7.5],
    ['hand', 'man', 7.5, 9],
    ['hand', 'child', 5.5, 6],
  ] as [BodyItem, Wearer, number, number][])('%s circumference, %s: %s-%s in', (item, wearer, min, max) => {
    expect(BODY_MEASUREMENTS.find((b) => b.item === item && b.wearer === wearer)).toMatchObject({ minIn: min, maxIn: max });
    // A piece exactly at the middle of the range has zero ease against it.
    const c = compareToBody({ value: (min + max) / 2, unit: 'in' }, item, wearer);
    expect(c?.ease.atMiddle.in).toBeCloseTo(0, 9);
    expect(c?.category).toBe('very-close');
  });

  it('has no guidance for pairs the references do not give (a toddler hand)', () => {
    expect(compareToBody({ value: 5, unit: 'in' }, 'hand', 'toddler')).toBeNull();
  });
});

describe('hats are usually worn 5-10 % smaller than the head (references.md Sizing)', () => {
  // Adult heads 21-23 in: a hat suits some head in the range when it is between
  // 90 % of 21 in (18.9 in) and 95 % of 23 in (21.85 in).
  it.each([
    [18.9, true],
    [18.8, false],
    [20, true],
    [21.85, true],
    [21.9, false],
    [22, false],
  ])('an adult hat of %s in: within the negative-ease guidance = %s', (inches, within) => {
    expect(compareToBody({ value: inches, unit: 'in' }, 'hat', 'adult')?.isWithinHatGuidance).toBe(within);
  });

  it('an adult hat 5 % smaller than a 22 in head has -5 % ease at the middle of the range', () => {
    const c = compareToBody({ value: 22 * 0.95, unit: 'in' }, 'hat', 'adult');
    expect(c?.easeFractionAtMiddle).toBeCloseTo(-0.05, 9);
    expect(c?.category).toBe('negative');
    expect(c?.message).toContain('within the usual 5–10 % negative ease for hats');
  });

  it('the same finished size given in cm (convert-units) compares the same', () => {
    const inCm = compareToBody({ value: convert(20).from('in').to('cm'), unit: 'cm' }, 'hat', 'adult');
    expect(inCm?.ease.atMiddle.in).toBeCloseTo(-2, 5);
  });

  it('a 14 in hat suits a baby (13-16 in heads); a 15 in hat (heads 15.8-16.7 in) a toddler or a baby', () => {
    expect(suitableWearers({ value: 14, unit: 'in' }, 'hat')).toEqual(['baby']);
    expect(suitableWearers({ value: 15, unit: 'in' }, 'hat')).toEqual(['toddler', 'baby']);
    expect(suitableWearers({ value: 20, unit: 'in' }, 'hat')).toEqual(['adult']); // heads 21.1-22.2 in
    expect(suitableWearers({ value: 19.5, unit: 'in' }, 'hat')).toEqual(['adult', 'child']); // heads 20.5-21.7 in
  });
});

describe('ease categories (references.md Sizing: a yarn maker\'s fit chart)', () => {
  it.each([
    [0, 'very-close'],
    [1, 'close'],
    [1.5, 'close'],
    [2, 'standard'],
    [3, 'standard'],
    [4, 'loose'],
    [5, 'loose'],
    [6, 'oversized'],
    [9, 'oversized'],
    [-0.5, 'negative'],
  ] as const)('+%s in of ease is %s', (ease, category) => {
    expect(easeCategory(ease)).toBe(category);
  });
});

describe('finished circumference from counts and gauge (references.md Standards: sts per in = sts per 4 in / 4)', () => {
  it('112 sts at 22 sts per 4 in (5.5 sts/in) is 20.36 in around, an adult hat with negative ease', () => {
    const g = normalizeGauge({ stitches: 22, rows: 30, per: '4in' });
    const size = finishedSize({ frontStitches: 112, rows: 60, construction: 'round' }, g);
    expect(size.widthKind).toBe('circumference');
    expect(size.width.in).toBeCloseTo(112 / 5.5, 9);
    expect(size.width.cm).toBeCloseTo(convert(112 / 5.5).from('in').to('cm'), 4);
    expect(size.length.in).toBeCloseTo(8, 9);
    expect(compareToBody(size.width, 'hat', 'adult')?.isWithinHatGuidance).toBe(true);
  });

  it('48 front sts at 28 sts per 10 cm is a 17.1 cm (6.75 in) mitt: a woman\'s hand (6-7.5 in)', () => {
    const g = normalizeGauge({ stitches: 28, rows: 36, per: '10cm' });
    const size = finishedSize({ frontStitches: 48, rows: 50, construction: 'round' }, g);
    expect(size.width.cm).toBeCloseTo((48 / 28) * 10, 9);
    expect(size.width.in).toBeCloseTo(convert((48 / 28) * 10).from('cm').to('in'), 5);
    expect(suitableWearers(size.width, 'hand')).toEqual(['woman']);
  });
});
