/**
 * Stitch arithmetic of the compiler against the trade's published
 * abbreviation lists (references.md "Stitch arithmetic": knitting
 * publishers' and teachers' abbreviation pages, e.g. DMC's knitting
 * abbreviations page; Tin Can Knits on sl1-k2tog-psso "decreases the stitch
 * count by 2"). Lifted increases: one new stitch from the stitch below, +1
 * (derived, no source states the number).
 */
import { describe, expect, it } from 'vitest';
import { compile } from '../../shared/index.ts';

/** Net change on the needle, as the references list it. */
const table: [string, number, string][] = [
  ['k', 0, 'published abbreviation lists'], ['p', 0, 'published abbreviation lists'], ['sl', 0, 'published abbreviation lists'],
  ['k1 tbl', 0, 'published abbreviation lists (tbl)'], ['sl1 wyif', 0, 'published abbreviation lists (wyif)'],
  ['sl1 wyib', 0, 'published abbreviation lists (wyib)'], ['mark m, k', 0, 'published abbreviation lists (pm)'],
  ['k2tog', -1, 'published abbreviation lists'], ['ssk', -1, 'published abbreviation lists'], ['p2tog', -1, 'published abbreviation lists'],
  ['ssp', -1, 'published abbreviation lists'], ['skpo', -1, 'published abbreviation lists'],
  ['k3tog', -2, 'published abbreviation lists'], ['sk2p', -2, 'Tin Can Knits: sl1-k2tog-psso decreases the count by 2'],
  ['cdd', -2, 'published abbreviation lists (s2kp, centred double decrease)'], ['sssk', -2, 'published abbreviation lists'],
  ['yo', 1, 'published abbreviation lists'], ['m1', 1, 'published abbreviation lists'], ['m1l', 1, 'published abbreviation lists'],
  ['m1r', 1, 'published abbreviation lists'], ['kfb', 1, 'published abbreviation lists'], ['pfb', 1, 'published abbreviation lists'],
  ['lli', 1, 'derived: a lifted increase makes one stitch from the stitch below'], ['rli', 1, 'derived: a lifted increase makes one stitch from the stitch below'],
];

describe('net change on the needle per abbreviation (references.md, stitch arithmetic)', () => {
  for (const [op, net, source] of table) {
    it(`${op}: ${net >= 0 ? '+' : ''}${net} (${source})`, () => {
      const r = compile(`yarn A "Harbour" #1d3557\ncast on 20\nround 1: k 5, ${op}, k to end\nround 2: k to end`);
      expect(r.diagnostics).toEqual([]);
      expect(r.sizes[0].rounds.map((x) => x.front)).toEqual([20 + net, 20 + net]);
    });
  }

  it('a decrease worked 10 times changes the count 10 times over (80 sts, (k6, k2tog) 10 times -> 70)', () => {
    const r = compile('yarn A "Harbour" #1d3557\ncast on 80\nround 1: (k 6, k2tog) 10 times');
    expect(r.sizes[0].rounds[0].front).toBe(70);
  });
});
