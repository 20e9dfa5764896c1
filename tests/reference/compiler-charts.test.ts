/**
 * Chart reading against published chart-reading guides (references.md
 * "Charts": Annie's chart-reading guide; Vogue Knitting pattern help):
 * flat, RS rows are read right to left and WS rows left to right; in the
 * round every round is a RS round read right to left; a symbol shows the
 * stitch as seen from the RS, so a knit cell is purled on a WS row;
 * no-stitch cells are skipped.
 */
import { describe, expect, it } from 'vitest';
import { compile, type CompileResult } from '../../shared/index.ts';

const chart = `chart c:
  key "x" B
  key "." A
  key "-" A p
  key "o" none
  |x..-|`;

/** The first `n` worked stitches of round `round` as "yarn:op". */
function worked(r: CompileResult, round: number, n = 4): string[] {
  const s = r.sizes[0].stitches;
  const rec = s.rounds[round - 1];
  const out: string[] = [];
  for (let i = rec.offset; i < rec.offset + Math.min(n, rec.count); i++) out.push(`${s.yarns[s.store.yarn[i]]}:${s.ops[s.store.op[i]].name}`);
  return out;
}

const head = 'gauge 28 sts and 32 rows per 10 cm\nyarn A "Harbour" #1d3557\nyarn B "Sea Foam" #cfe8e0\n';

describe('chart reading directions', () => {
  it('in the round every round is read right to left (Annie\'s chart-reading guide; Vogue Knitting pattern help)', () => {
    const r = compile(`${head}cast on 8\n${chart}\nrounds 1-2: chart c`);
    expect(r.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    expect(worked(r, 1)).toEqual(['A:p', 'A:k', 'A:k', 'B:k']);
    expect(worked(r, 2)).toEqual(['A:p', 'A:k', 'A:k', 'B:k']);
  });

  it('flat, RS rows read right to left, WS rows left to right with knit and purl swapped (same guides)', () => {
    const r = compile(`${head}work flat\ncast on 8\n${chart}\nrows 1-2: chart c`);
    expect(r.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    expect(r.sizes[0].rounds.map((x) => x.side)).toEqual(['RS', 'WS']);
    expect(worked(r, 1)).toEqual(['A:p', 'A:k', 'A:k', 'B:k']);
    // WS: leftmost cell first; the knit cells are purled and the purl cell knitted.
    expect(worked(r, 2)).toEqual(['B:p', 'A:p', 'A:p', 'A:k']);
  });

  it('no-stitch cells are skipped when working (published chart-reading guides)', () => {
    const r = compile(`${head}cast on 6\nchart d:\n  key "." A\n  key "o" none\n  |.o.|\nround 1: chart d`);
    expect(r.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    expect(r.sizes[0].rounds[0].front).toBe(6);
    expect(worked(r, 1, 6)).toEqual(['A:k', 'A:k', 'A:k', 'A:k', 'A:k', 'A:k']);
  });

  it('row 1 is the bottom row and rows follow the rounds they are worked in (common practice)', () => {
    const r = compile(`${head}cast on 4\nchart e:\n  key "." A\n  key "x" B\n  |xxxx|\n  |....|\nrounds 1-3: chart e`);
    expect(worked(r, 1)).toEqual(['A:k', 'A:k', 'A:k', 'A:k']);
    expect(worked(r, 2)).toEqual(['B:k', 'B:k', 'B:k', 'B:k']);
    expect(worked(r, 3)).toEqual(['A:k', 'A:k', 'A:k', 'A:k']);
  });
});

describe('what a stitch shows on the other side (chart-reading guides: symbols show the RS)', () => {
  it('a purl worked on a WS row shows as knit from the RS, and p2tog as k2tog', async () => {
    const { asSeenFromRightSide, STITCHES } = await import('../../shared/index.ts');
    const by = (n: string) => STITCHES.find((s) => s.name === n)!;
    expect(asSeenFromRightSide(by('p'), 'WS').name).toBe('k');
    expect(asSeenFromRightSide(by('k'), 'WS').name).toBe('p');
    expect(asSeenFromRightSide(by('p2tog'), 'WS').name).toBe('k2tog');
    expect(asSeenFromRightSide(by('ssp'), 'WS').name).toBe('ssk');
    expect(asSeenFromRightSide(by('p'), 'RS').name).toBe('p');
    expect(asSeenFromRightSide(by('yo'), 'WS').name).toBe('yo');
  });
});
