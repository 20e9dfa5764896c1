/**
 * The rendered chart against published chart-reading guides (references.md
 * "Charts": Annie's chart-reading guide; Vogue Knitting pattern help):
 * - in the round every round is read from right to left, so its number sits
 *   on the right; flat, RS rows are read right to left (number on the
 *   right) and WS rows left to right (number on the left);
 * - symbols show the stitch as it looks on the right side: a stitch purled
 *   on a WS row is drawn as a knit cell;
 * - no-stitch cells keep the grid square where counts change.
 * A chart block worked in the source must come out of the renderer drawn
 * exactly as the designer drew it, in the round and flat.
 */
import { describe, expect, it } from 'vitest';
import { XMLParser } from 'fast-xml-parser';
import { compile } from '../../shared/index.ts';
import { buildChart, renderChartSvg, type ChartModel } from '../../shared/render/index.ts';

const head = 'gauge 28 sts and 32 rows per 10 cm\nyarn A "Harbour" #1d3557\nyarn B "Sea Foam" #cfe8e0\n';
// Drawn as on paper: the top line is row 3, the bottom line row 1.
const grid = ['|..x.-x|', '|.x.x.x|', '|x..-.x|'];
const chart = `chart c:\n  key "." A\n  key "x" B\n  key "-" A p\n${grid.map((g) => `  ${g}`).join('\n')}`;

/** A row of the model as drawn, left to right: "x" for B, "-" for a purl in A, "." for a knit in A. */
function drawn(model: ChartModel, row: number): string {
  return model.rows[row - 1].cells.map((c) => (!c ? ' ' : c.yarn === 'B' ? 'x' : c.symbol === 'purl' ? '-' : '.')).join('');
}

describe('rendered chart reproduces the chart as drawn', () => {
  it('in the round (every round read right to left)', () => {
    const r = compile(`${head}cast on 12\n${chart}\nrounds 1-3: chart c`);
    expect(r.ok).toBe(true);
    const model = buildChart(r)!;
    for (let row = 1; row <= 3; row++) expect(drawn(model, row)).toBe(grid[3 - row].slice(1, -1).repeat(2));
    expect(model.rows.every((x) => x.readFrom === 'right')).toBe(true);
  });

  it('flat (RS rows right to left, WS rows left to right, symbols as seen from the RS)', () => {
    const r = compile(`${head}work flat\ncast on 12\n${chart}\nrows 1-3: chart c`);
    expect(r.ok).toBe(true);
    const model = buildChart(r)!;
    for (let row = 1; row <= 3; row++) expect(drawn(model, row)).toBe(grid[3 - row].slice(1, -1).repeat(2));
    // Row 2 is a WS row: all 12 of its knit cells were purled, and they are drawn as knit cells.
    const level = r.sizes[0].stitches;
    const rec = level.rounds[1];
    const purled = Array.from({ length: rec.count }, (_, i) => level.ops[level.store.op[rec.offset + i]].name).filter((n) => n === 'p').length;
    expect(purled).toBe(12);
    expect(model.rows.map((x) => x.readFrom)).toEqual(['right', 'left', 'right']);
  });
});

describe('round and row numbers sit on the side they are read from', () => {
  /** Which side of the grid each round number is drawn on (the grid's left edge is its leftmost cell). */
  function numberSides(svg: string): Map<number, 'left' | 'right'> {
    const parsed = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '' }).parse(svg);
    const groups = [parsed.svg.g].flat();
    const cells = groups.find((g: { class?: string }) => g.class === 'cells');
    const gridLeft = Math.min(...[cells.g].flat().flatMap((row: { use: unknown }) => [row.use].flat().map((u) => Number((u as { x: string }).x))));
    const nums = groups.find((g: { class?: string }) => g.class === 'row-numbers');
    const out = new Map<number, 'left' | 'right'>();
    for (const t of [nums.text].flat()) out.set(Number(t['data-round']), Number(t.x) < gridLeft ? 'left' : 'right');
    return out;
  }

  it('in the round, every number on the right', () => {
    const r = compile(`${head}cast on 12\n${chart}\nrounds 1-4: chart c`);
    const model = buildChart(r)!;
    const sides = numberSides(renderChartSvg(model));
    expect([...sides.values()]).toEqual(['right', 'right', 'right', 'right']);
  });

  it('flat, RS rows on the right and WS rows on the left', () => {
    const r = compile(`${head}work flat\ncast on 12\n${chart}\nrows 1-4: chart c`);
    const sides = numberSides(renderChartSvg(buildChart(r)!));
    expect([...sides]).toEqual([[1, 'right'], [2, 'left'], [3, 'right'], [4, 'left']]);
  });
});

describe('no-stitch cells where counts change', () => {
  it('a worked example of decreasing evenly (references.md: 80 sts, k3, k2tog, (k6, k2tog) 9 times, k3 = 70 sts) leaves 10 no-stitch cells', () => {
    const r = compile(`${head}cast on 80\nround 1: k to end\nround 2: k3, k2tog, (k6, k2tog) 9 times, k3\nround 3: k to end`);
    const model = buildChart(r)!;
    expect(model.width).toBe(80);
    expect(model.rows[1].cells.filter((c) => c === null).length).toBe(10);
    expect(model.rows[2].cells.filter((c) => c === null).length).toBe(10);
    expect(model.legend).toContain('no-stitch');
  });
});
