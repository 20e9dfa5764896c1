/**
 * The gauge a pattern declares, as the compiler reads it, classified with
 * the Craft Yarn Council Standard Yarn Weight System ranges (references.md:
 * stitches in stockinette per 4 in: 1 Super Fine 27-32, 4 Medium 16-20,
 * 5 Bulky 12-15). 1 in = 2.54 cm: 28 sts per 10 cm = 28.45 sts per 4 in.
 */
import { describe, expect, it } from 'vitest';
import { compile } from '../../shared/index.ts';
import { classifyYarnWeight } from '../../shared/measure/index.ts';

function weightOf(gaugeLine: string): number[] {
  const r = compile(`${gaugeLine}\nyarn A "Harbour" #1d3557\ncast on 4\nround 1: k to end`);
  return classifyYarnWeight(r.header.gauge!).matches.map((m) => m.category.number);
}

describe('declared gauge classified by the Craft Yarn Council ranges', () => {
  it('28 sts per 10 cm (the Tidepool Cowl) is 28.45 per 4 in: 1 Super Fine (27-32)', () => {
    expect(weightOf('gauge 28 sts and 32 rounds per 10 cm')).toEqual([1]);
  });
  it('20 sts per 4 in (the Quarry Tote panel) is 4 Medium (16-20)', () => {
    expect(weightOf('gauge 20 sts and 28 rows per 4 in')).toEqual([4]);
  });
  it('a gauge over 2 in is scaled exactly: 7 sts over 2 in = 14 per 4 in, 5 Bulky (12-15)', () => {
    expect(weightOf('gauge 7 sts and 9 rows over 2 in')).toEqual([5]);
  });
});
