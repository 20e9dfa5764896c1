// Edge cases and properties of shared/measure/shaping.ts.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  K2TOG,
  M1,
  countSegments,
  ordinal,
  spaceShapingEvenly,
  spreadShapingOverLength,
  type ShapingLayout,
  type ShapingStitch,
} from '../../../shared/measure';

const STITCHES: ShapingStitch[] = [K2TOG, M1, { name: 'kfb', consumes: 1, produces: 2 }, { name: 'k3tog', consumes: 3, produces: 1 }];
const layout = fc.constantFrom<ShapingLayout>('round', 'flat', 'flat-sections');

/** Re-reads our own text ("k3, k2tog, [k6, k2tog] 9 times") into consumed/produced counts. */
function countText(text: string, stitches: ShapingStitch[]): { consumed: number; produced: number } {
  let pos = 0;
  function sequence(): { consumed: number; produced: number } {
    let consumed = 0;
    let produced = 0;
    while (pos < text.length && text[pos] !== ']') {
      if (text[pos] === '[') {
        pos++;
        const inner = sequence();
        const m = /^\] (\d+) times/.exec(text.slice(pos));
        if (!m) throw new Error(`bad repeat at ${pos}`);
        pos += m[0].length;
        consumed += inner.consumed * Number(m[1]);
        produced += inner.produced * Number(m[1]);
      } else {
        const m = /^[a-z0-9]+/.exec(text.slice(pos));
        if (!m) throw new Error(`bad token at ${pos} in ${text}`);
        pos += m[0].length;
        const shaping = stitches.find((s) => s.name === m[0]);
        if (shaping) {
          consumed += shaping.consumes;
          produced += shaping.produces;
        } else {
          const n = Number(m[0].slice(1));
          consumed += n;
          produced += n;
        }
      }
      if (text.startsWith(', ', pos)) pos += 2;
    }
    return { consumed, produced };
  }
  return sequence();
}

describe('spaceShapingEvenly', () => {
  it('segments and text work exactly the stitches on the needle into the new count (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 600 }), fc.integer({ min: 1, max: 120 }), layout, fc.constantFrom(...STITCHES), (n, d, lay, stitch) => {
        const outcome = spaceShapingEvenly({ stitches: n, shapings: d, layout: lay, stitch });
        if (n < d * stitch.consumes) {
          expect(outcome.ok).toBe(false);
          return;
        }
        expect(outcome.ok).toBe(true);
        if (!outcome.ok) return;
        const s = outcome.value;
        expect(s.after).toBe(n + d * (stitch.produces - stitch.consumes));
        expect(countSegments(s.segments)).toEqual({ consumed: n, produced: s.after, shapings: d });
        expect(countText(s.text, [stitch])).toEqual({ consumed: n, produced: s.after });
        expect(s.gaps.reduce((a, b) => a + b, 0)).toBe(n - d * stitch.consumes);
        expect(s.positions).toHaveLength(d);
        for (let k = 1; k < d; k++) expect(s.positions[k]).toBeGreaterThanOrEqual(s.positions[k - 1] + stitch.consumes);
      }),
    );
  });

  it('is even: intervals between shapings differ by at most one stitch; flat edges share one interval (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 600 }), fc.integer({ min: 1, max: 120 }), layout, (n, d, lay) => {
        const outcome = spaceShapingEvenly({ stitches: n + 2 * d, shapings: d, layout: lay });
        if (!outcome.ok) throw new Error(outcome.problem.message);
        const gaps = outcome.value.gaps;
        const intervals = lay === 'round' ? gaps.slice(0, -1) : lay === 'flat' ? gaps.slice(1, -1) : gaps;
        if (intervals.length > 0) expect(Math.max(...intervals) - Math.min(...intervals)).toBeLessThanOrEqual(1);
        if (lay === 'flat') {
          const edges = gaps[0] + gaps[gaps.length - 1];
          expect(edges).toBe(Math.floor(n / d));
          expect(Math.abs(gaps[0] - gaps[gaps.length - 1])).toBeLessThanOrEqual(1);
        }
      }),
    );
  });

  it('reports too few stitches for the decreases with both numbers', () => {
    const outcome = spaceShapingEvenly({ stitches: 50, shapings: 30, layout: 'round' });
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) {
      expect(outcome.problem.code).toBe('shaping-too-few-stitches');
      expect(outcome.problem.message).toBe('30 × k2tog need 60 stitches but only 50 are on the needle');
    }
  });

  it.each([
    [{ stitches: 10.5, shapings: 2 }, 'shaping-stitches'],
    [{ stitches: -1, shapings: 2 }, 'shaping-stitches'],
    [{ stitches: 10, shapings: 0 }, 'shaping-count'],
    [{ stitches: 10, shapings: Number.NaN }, 'shaping-count'],
    [{ stitches: 10_000_000, shapings: 2 }, 'shaping-stitches'],
  ])('refuses %o with %s', (req, code) => {
    const outcome = spaceShapingEvenly({ ...req, layout: 'round' });
    expect(!outcome.ok && outcome.problem.code).toBe(code);
  });

  it('writes runs of adjacent shapings as a repeat and nests repeats', () => {
    const tight = spaceShapingEvenly({ stitches: 6, shapings: 3, layout: 'round' });
    expect(tight.ok && tight.value.text).toBe('[k2tog] 3 times');
    const nested = spaceShapingEvenly({ stitches: 74, shapings: 30, layout: 'round', stitch: { name: 'p2tog', consumes: 2, produces: 1 }, plain: 'p' });
    expect(nested.ok && nested.value.text).toBe('[[p1, p2tog, p2tog] 7 times, p2tog] 2 times');
  });

  it('one shaping in the round goes at the end; flat, in the middle', () => {
    const round = spaceShapingEvenly({ stitches: 20, shapings: 1, layout: 'round', kind: 'increase' });
    expect(round.ok && round.value.text).toBe('k20, m1');
    const flat = spaceShapingEvenly({ stitches: 20, shapings: 1, layout: 'flat', kind: 'increase' });
    expect(flat.ok && flat.value.text).toBe('k10, m1, k10');
  });
});

describe('spreadShapingOverLength', () => {
  it('uses every row and every shaping, with intervals one step apart (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 400 }), fc.integer({ min: 1, max: 400 }), fc.integer({ min: 1, max: 4 }), (rows, shapings, step) => {
        const outcome = spreadShapingOverLength({ rows, shapings, rowStep: step });
        if (Math.floor(rows / step) < shapings) {
          expect(!outcome.ok && outcome.problem.code).toBe('length-too-short');
          return;
        }
        if (!outcome.ok) throw new Error(outcome.problem.message);
        const s = outcome.value;
        expect(s.intervals.reduce((a, i) => a + i.times, 0)).toBe(shapings);
        expect(s.intervals.reduce((a, i) => a + i.every * i.times, 0)).toBe(s.rowsUsed);
        expect(s.rowsUsed + s.plainRowsAfter).toBe(rows);
        expect(s.plainRowsAfter).toBeLessThan(step);
        expect(s.shapingRows).toHaveLength(shapings);
        expect(s.shapingRows.at(-1)).toBe(s.rowsUsed);
        for (const i of s.intervals) expect(i.every % step).toBe(0);
        if (s.intervals.length === 2) expect(s.intervals[1].every - s.intervals[0].every).toBe(step);
      }),
    );
  });

  it('writes the plan in words, with plain rows left over', () => {
    const rs = spreadShapingOverLength({ rows: 61, shapings: 10, rowStep: 2, unit: 'round' });
    expect(rs.ok && rs.value.text).toBe('every 6th round 10 times, then work 1 round plain');
    const each = spreadShapingOverLength({ rows: 5, shapings: 5 });
    expect(each.ok && each.value.text).toBe('every row 5 times');
    const one = spreadShapingOverLength({ rows: 7, shapings: 2 });
    expect(one.ok && one.value.text).toBe('every 3rd row 1 time, then every 4th row 1 time');
  });

  it('says how many rows are missing', () => {
    const outcome = spreadShapingOverLength({ rows: 30, shapings: 36 });
    expect(!outcome.ok && outcome.problem.message).toBe('36 shapings need at least 36 rows (one every row); there are 30');
  });

  it.each([
    [1, '1st'], [2, '2nd'], [3, '3rd'], [4, '4th'], [11, '11th'], [12, '12th'], [13, '13th'], [21, '21st'], [22, '22nd'], [101, '101st'], [111, '111th'],
  ])('ordinal(%i) = %s', (n, text) => {
    expect(ordinal(n)).toBe(text);
  });
});
