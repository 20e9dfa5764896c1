/**
 * Every "spacing shaping evenly" worked example of references.md, written as
 * a Loopwright round (or rounds) and checked for the resulting counts and
 * where the shaping falls. Source: published worked examples of spacing
 * increases and decreases evenly (references.md, "Spacing shaping evenly").
 */
import { describe, expect, it } from 'vitest';
import { compile, type CompileResult } from '../../shared/index.ts';

const yarn = 'yarn A "Harbour" #1d3557\n';

/** Plain stitches between the increases of round `round` (stitch-level data). */
function gaps(r: CompileResult, round: number, opName: string): number[] {
  const s = r.sizes[0].stitches;
  const rec = s.rounds[round - 1];
  const out: number[] = [];
  let run = 0;
  for (let i = rec.offset; i < rec.offset + rec.count; i++) {
    if (s.ops[s.store.op[i]].name === opName) { out.push(run); run = 0; } else run++;
  }
  out.push(run);
  return out;
}

describe('spacing shaping evenly (references.md worked examples)', () => {
  it('40 sts, increase 4 evenly: 5 sections of 8 (spaces = increases + 1) -> 44', () => {
    const r = compile(`${yarn}work flat\ncast on 40\nrow 1: (k 8, m1) 4 times, k 8`);
    expect(r.diagnostics).toEqual([]);
    expect(r.sizes[0].rounds[0].front).toBe(44);
    expect(gaps(r, 1, 'm1')).toEqual([8, 8, 8, 8, 8]);
  });

  it('51 sts in the round, 4 increases after sts 13, 26, 39, 51 -> 55', () => {
    const r = compile(`${yarn}cast on 51\nround 1: (k 13, m1) 3 times, k 12, m1`);
    expect(r.diagnostics).toEqual([]);
    expect(r.sizes[0].rounds[0].front).toBe(55);
    expect(gaps(r, 1, 'm1')).toEqual([13, 13, 13, 12, 0]);
  });

  it('51 sts flat, starting at half an interval: increases after sts 6, 19, 32, 45 -> 55', () => {
    const r = compile(`${yarn}work flat\ncast on 51\nrow 1: k 6, m1, (k 13, m1) 3 times, k to end`);
    expect(r.diagnostics).toEqual([]);
    expect(r.sizes[0].rounds[0].front).toBe(55);
    const g = gaps(r, 1, 'm1');
    const after = g.slice(0, 4).map((_, i) => g.slice(0, i + 1).reduce((a, b) => a + b, 0));
    expect(after).toEqual([6, 19, 32, 45]);
  });

  it('112 sts, increase 16 evenly in the round: one every 7 sts -> 128', () => {
    const r = compile(`${yarn}cast on 112\nround 1: (k 7, m1) to end`);
    expect(r.diagnostics).toEqual([]);
    expect(r.sizes[0].rounds[0].front).toBe(128);
    expect(gaps(r, 1, 'm1')).toEqual([...Array(16).fill(7), 0]);
  });

  it('80 sts, decrease 10 evenly: k3, k2tog, (k6, k2tog) 9 times, k3 = 70', () => {
    const r = compile(`${yarn}cast on 80\nround 1: k 3, k2tog, (k 6, k2tog) 9 times, k 3`);
    expect(r.diagnostics).toEqual([]);
    expect(r.sizes[0].rounds[0].front).toBe(70);
  });

  it('74 sts, decrease 30: p2, [p2tog three times, p1] 10 times, p2 = 44', () => {
    const r = compile(`${yarn}cast on 74\nround 1: p 2, (p2tog 3, p 1) 10 times, p 2`);
    expect(r.diagnostics).toEqual([]);
    expect(r.sizes[0].rounds[0].front).toBe(44);
  });

  it('140 rows, 36 shapings: every 3rd row 4 times then every 4th row 32 times (4x3 + 32x4 = 140)', () => {
    const src = `${yarn}work flat\ncast on 20\nrows 1-140 every other: k to end\nrows 2-140 every other: p to end\n` +
      'rows 3-12 every 3rd: k 1, m1, k to end\nrows 16-140 every 4th: k 1, m1, k to end\n';
    const r = compile(src);
    expect(r.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    const rows = r.sizes[0].rounds;
    expect(rows).toHaveLength(140);
    const shaped = rows.filter((x, i) => x.front !== (i === 0 ? 20 : rows[i - 1].front)).map((x) => x.number);
    expect(shaped).toHaveLength(36);
    expect(shaped.slice(0, 4)).toEqual([3, 6, 9, 12]);
    expect(shaped.slice(4).every((n, i) => n === 16 + 4 * i)).toBe(true);
    expect(rows[139].front).toBe(56);
  });
});
