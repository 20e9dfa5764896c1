// Reference checks for shared/measure/shaping.ts against every worked example
// in ../shared/references.md, "Spacing shaping evenly (published worked
// examples)". Each test names the example it checks. Net changes of the
// stitches used (k2tog, p2tog −1; m1 +1) are from the same file's "Stitch
// arithmetic" section.
import { describe, expect, it } from 'vitest';
import {
  K2TOG,
  M1,
  countSegments,
  spaceShapingEvenly,
  spreadShapingOverLength,
  type EvenShaping,
  type ShapingSegment,
  type ShapingStitch,
} from '../../shared/measure';

const P2TOG: ShapingStitch = { name: 'p2tog', consumes: 2, produces: 1 };

function ok<T>(outcome: { ok: true; value: T } | { ok: false; problem: { message: string } }): T {
  if (!outcome.ok) throw new Error(outcome.problem.message);
  return outcome.value;
}

/** Stitch numbers (1-based, of the old count) after which each shaping falls. */
function shapingAfter(shaping: EvenShaping): number[] {
  return [...shaping.positions];
}

describe('references.md "Spacing shaping evenly" worked examples', () => {
  it('40 sts, increase 4 evenly: 5 sections of 8 (spaces = increases + 1)', () => {
    const s = ok(spaceShapingEvenly({ stitches: 40, shapings: 4, kind: 'increase', layout: 'flat-sections' }));
    expect(s.gaps).toEqual([8, 8, 8, 8, 8]);
    expect(s.text).toBe('[k8, m1] 4 times, k8');
    expect(s.after).toBe(44);
  });

  it('51 sts in the round, 4 increases: 51/4 = 12.75, increase after sts 13, 26, 39, 51', () => {
    const s = ok(spaceShapingEvenly({ stitches: 51, shapings: 4, kind: 'increase', layout: 'round' }));
    expect(shapingAfter(s)).toEqual([13, 26, 39, 51]);
    expect(s.after).toBe(55);
  });

  it('51 sts flat, 4 increases starting at half an interval: after sts 6, 19, 32, 45', () => {
    const s = ok(spaceShapingEvenly({ stitches: 51, shapings: 4, kind: 'increase', layout: 'flat' }));
    expect(shapingAfter(s)).toEqual([6, 19, 32, 45]);
    expect(s.text).toBe('k6, m1, [k13, m1] 3 times, k6');
    expect(s.after).toBe(55);
  });

  it('112 sts, increase 16 evenly in the round: one every 7 sts', () => {
    const s = ok(spaceShapingEvenly({ stitches: 112, shapings: 16, kind: 'increase', layout: 'round' }));
    expect(s.gaps.slice(0, -1).every((g) => g === 7)).toBe(true);
    expect(s.text).toBe('[k7, m1] 16 times');
    expect(s.after).toBe(128);
  });

  it('80 sts, decrease 10 evenly: k3, k2tog, (k6, k2tog) 9 times, k3 = 70 sts', () => {
    const s = ok(spaceShapingEvenly({ stitches: 80, shapings: 10, layout: 'flat', stitch: K2TOG }));
    expect(s.text).toBe('k3, k2tog, [k6, k2tog] 9 times, k3');
    expect(s.after).toBe(70);
    expect(countSegments(s.segments)).toEqual({ consumed: 80, produced: 70, shapings: 10 });
  });

  it('74 sts, decrease 30: p2, [p2tog three times, p1] 10 times, p2 = 44 sts', () => {
    // The published sequence, written as segments, adds up to 74 -> 44 ...
    const published: ShapingSegment[] = [
      { kind: 'work', stitch: 'p', count: 2 },
      { kind: 'repeat', times: 10, body: [{ kind: 'repeat', times: 3, body: [{ kind: 'shape', stitch: P2TOG }] }, { kind: 'work', stitch: 'p', count: 1 }] },
      { kind: 'work', stitch: 'p', count: 2 },
    ];
    expect(countSegments(published)).toEqual({ consumed: 74, produced: 44, shapings: 30 });
    // ... and so does ours, for both layouts. (Our flat layout places the 14
    // plain stitches as evenly as whole stitches allow; the published one
    // groups the decreases in threes. Both work 74 sts into 44.)
    for (const layout of ['flat', 'round'] as const) {
      const s = ok(spaceShapingEvenly({ stitches: 74, shapings: 30, layout, stitch: P2TOG, plain: 'p' }));
      expect(s.after).toBe(44);
      expect(countSegments(s.segments)).toEqual({ consumed: 74, produced: 44, shapings: 30 });
      // Evenness: plain stitches between decreases differ by at most one.
      const inner = layout === 'round' ? s.gaps.slice(0, -1) : s.gaps.slice(1, -1);
      expect(Math.max(...inner) - Math.min(...inner)).toBeLessThanOrEqual(1);
    }
  });

  it('shaping over length: 140 rows, 36 shapings: 140 = 36 × 3 + 32, every 3rd row 4 times and every 4th row 32 times', () => {
    const s = ok(spreadShapingOverLength({ rows: 140, shapings: 36 }));
    expect(s.intervals).toEqual([
      { every: 3, times: 4 },
      { every: 4, times: 32 },
    ]);
    expect(4 * 3 + 32 * 4).toBe(140);
    expect(s.rowsUsed).toBe(140);
    expect(s.shapingRows).toHaveLength(36);
    expect(s.shapingRows.at(-1)).toBe(140);
    expect(s.text).toBe('every 3rd row 4 times, then every 4th row 32 times');
  });

  it('the increases used above add one stitch each (references.md Stitch arithmetic: m1 +1, k2tog −1)', () => {
    expect(M1.produces - M1.consumes).toBe(1);
    expect(K2TOG.produces - K2TOG.consumes).toBe(-1);
    expect(P2TOG.produces - P2TOG.consumes).toBe(-1);
  });
});
