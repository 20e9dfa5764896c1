/**
 * Floats and units in the compiler against references.md:
 * - 1 in = 2.54 cm exactly (international inch), checked against the
 *   general-purpose `convert-units` package as an oracle;
 * - catch a float longer than about 1 in (2.5 cm) at the knitter's gauge
 *   (common practice: Purl Soho "trapping floats", Knotions "stranding and
 *   catching"); at about 7 sts/in, catches every 5-6 sts keep floats under
 *   an inch (common practice).
 */
import { describe, expect, it } from 'vitest';
import convert from 'convert-units';
import { compile } from '../../shared/index.ts';

const head = (gauge: string, limit = '') =>
  `gauge ${gauge}\nyarn A "Harbour" #1d3557\nyarn B "Sea Foam" #cfe8e0\n${limit}\n`;

describe('float limit at the declared gauge', () => {
  it('7 sts/in (28 sts per 4 in), limit 1 in: a 7-stitch float passes, an 8-stitch float warns (common practice)', () => {
    const ok = compile(`${head('28 sts and 36 rounds per 4 in')}cast on 40\nround 1: (k 7 in A, k 1 in B) to end`);
    expect(ok.diagnostics).toEqual([]);
    expect(ok.sizes[0].rounds[0].longestFloat).toEqual({ yarn: 'B', stitches: 7 });
    const long = compile(`${head('28 sts and 36 rounds per 4 in')}cast on 45\nround 1: (k 8 in A, k 1 in B) to end`);
    expect(long.diagnostics.map((d) => d.code)).toEqual(['LW501']);
    expect(long.sizes[0].rounds[0].longestFloat).toEqual({ yarn: 'B', stitches: 8 });
  });

  it('the warning gives the length in inches and in cm, with 1 in = 2.54 cm (convert-units as oracle)', () => {
    const r = compile(`${head('28 sts and 36 rounds per 4 in')}cast on 45\nround 1: (k 8 in A, k 1 in B) to end`);
    const m = /floats behind 8 stitches \(([\d.]+) in \/ ([\d.]+) cm\)/.exec(r.diagnostics[0].message);
    expect(m).not.toBeNull();
    const inches = 8 / 7;
    expect(Number(m![1])).toBeCloseTo(inches, 2);
    expect(Number(m![2])).toBeCloseTo(convert(inches).from('in').to('cm'), 1);
    expect(convert(1).from('in').to('cm')).toBeCloseTo(2.54, 6);
  });

  it('at 7 sts/in a catch every 6 stitches keeps every float under 1 in (common practice)', () => {
    const r = compile(`${head('28 sts and 36 rounds per 4 in')}cast on 36\nround 1: k 1 in B, (k 5 in A, catch B) 7 times`);
    expect(r.diagnostics).toEqual([]);
    expect(r.sizes[0].rounds[0].longestFloat!.stitches).toBeLessThanOrEqual(6);
    expect(r.sizes[0].rounds[0].longestFloat!.stitches / 7).toBeLessThan(1);
  });

  it('a limit in cm is the same limit: 2.54 cm at 28 sts per 10 cm allows 7 stitches, not 8', () => {
    const g = '28 sts and 32 rounds per 10 cm';
    expect(compile(`${head(g, 'float limit 2.54 cm')}cast on 40\nround 1: (k 7 in A, k 1 in B) to end`).diagnostics).toEqual([]);
    expect(compile(`${head(g, 'float limit 2.54 cm')}cast on 45\nround 1: (k 8 in A, k 1 in B) to end`).diagnostics.map((d) => d.code)).toEqual(['LW501']);
  });

  it('backing stitches in the travelling yarn catch its float (ladder-back: columns 3-5 stitches apart, common practice)', () => {
    const plain = compile(`${head('28 sts and 36 rounds per 4 in')}cast on 40\nround 1: k 1 in B, k to end in A`);
    expect(plain.diagnostics.map((d) => d.code)).toEqual(['LW501']);
    const ladder = compile(`${head('28 sts and 36 rounds per 4 in')}cast on 40\nladder B every 5 from round 1 to 3\nrounds 1-3: k to end in A`);
    expect(ladder.diagnostics).toEqual([]);
    expect(ladder.sizes[0].rounds[1].longestFloat).toEqual({ yarn: 'B', stitches: 5 });
  });

  it('a gauge per 4 in is kept as declared, not treated as per 10 cm (10.16 cm)', () => {
    const r = compile(`${head('22 sts and 30 rows per 4 in')}cast on 4\nround 1: k to end`);
    expect(r.header.gauge).toEqual({ stitches: 22, rows: 30, per: '4in' });
  });
});
