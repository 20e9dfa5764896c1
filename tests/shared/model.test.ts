/**
 * The stitch-level model documented in shared/check/README.md: cast-on
 * first, each round's stitches in working order with op, yarn, flags,
 * source and backing column; repeated identical rounds share stitches.
 */
import { describe, expect, it } from 'vitest';
import { compile, FLAG } from '../../shared/index.ts';
import { pattern } from './fixtures.ts';

describe('stitch-level model', () => {
  const r = compile(pattern('round 1: k 2, raise B, k to end\nrounds 2-5: k 2, carry, k to end\nround 6: k 2, close, k to end\nrounds 7-9: k to end', 6));
  const s = r.sizes[0].stitches;
  const slice = (n: number) => {
    const rec = s.rounds[n - 1];
    return Array.from({ length: rec.count }, (_, i) => {
      const k = rec.offset + i;
      return `${s.ops[s.store.op[k]].name}/${s.yarns[s.store.yarn[k]]}${s.store.flags[k] & FLAG.BACKING ? '/back' : ''}`;
    });
  };

  it('stores the cast-on first and each round in working order', () => {
    expect(r.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    expect(Array.from(s.store.op.subarray(0, 6)).map((o) => s.ops[o].name)).toEqual(Array(6).fill('co'));
    expect(slice(1)).toEqual(['k/A', 'k/A', 'raise/B/back', 'k/A', 'k/A', 'k/A', 'k/A']);
    expect(slice(3)).toEqual(['k/A', 'k/A', 'carry/B/back', 'k/A', 'k/A', 'k/A', 'k/A']);
    expect(slice(6)).toEqual(['k/A', 'k/A', 'close k2tog/A', 'k/A', 'k/A', 'k/A']);
  });

  it('points every stitch at its source line and every backing stitch at its column', () => {
    const rec = s.rounds[0];
    expect(s.sources[s.store.src[rec.offset + 2]].line).toBe(7);
    expect(s.store.col[rec.offset + 2]).toBe(0);
    expect(s.columns[0]).toMatchObject({ round: 1 });
    expect(s.store.col[rec.offset]).toBe(-1);
  });

  it('lets identical consecutive rounds share their stitches, and only those', () => {
    const off = s.rounds.map((x) => x.offset);
    expect(off[2]).toBe(off[1]); // rounds 2-5 carry the same column on an unchanged needle
    expect(off[4]).toBe(off[1]);
    expect(off[5]).not.toBe(off[4]); // round 6 closes it
    expect(off[7]).toBe(off[6]); // rounds 7-9 plain
    expect(s.rounds.map((x) => x.number)).toEqual([1, 2, 3, 4, 5, 6, 7, 8, 9]);
  });

  it('does not share rounds whose chart row changes with the round', () => {
    const c = compile(pattern('chart c:\n  key "." A\n  key "x" B\n  |x.|\n  |.x|\nrounds 1-4: chart c', 8));
    const offs = c.sizes[0].stitches.rounds.map((x) => x.offset);
    expect(new Set(offs).size).toBe(4);
  });
});
