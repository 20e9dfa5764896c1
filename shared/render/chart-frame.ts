/**
 * What the front chart and the back-of-work view share: the geometry, the
 * symbol definitions, round/row numbers on the side each is read from,
 * column numbers, markers, and the legend (only the symbols used, and the
 * yarns).
 */
import { el, text } from './svg';
import { symbolDef, type SymbolId } from './symbols';
import type { ChartModel, ChartRow } from './chart-model';

/** Drawing options shared by both views. */
export interface ChartDrawOptions {
  /** Cell size in px; default 16. */
  cell?: number;
}

/** Geometry of a drawing. */
export interface Frame {
  cell: number;
  left: number;
  top: number;
  gridWidth: number;
  gridHeight: number;
  /** y (px) of the top of a row, by index in model.rows. */
  rowY: (index: number) => number;
  /** x (px) of the left edge of column x. */
  colX: (x: number) => number;
  width: number;
  /** y where the legend starts. */
  legendTop: number;
}

const NUMBER_GUTTER = 36;
const TITLE_SPACE = 64;

/** Lays out a chart: title on top, grid, numbers on both sides, legend below. */
export function frameFor(model: ChartModel, options: ChartDrawOptions, minWidth: number): Frame {
  const cell = options.cell ?? 16;
  const gridWidth = model.width * cell;
  const gridHeight = model.rows.length * cell;
  const inner = NUMBER_GUTTER * 2 + gridWidth;
  const width = Math.max(inner, minWidth) + 16;
  const left = Math.round(8 + NUMBER_GUTTER + Math.max(0, (Math.max(inner, minWidth) - inner) / 2));
  const top = TITLE_SPACE;
  const n = model.rows.length;
  return {
    cell, left, top, gridWidth, gridHeight, width,
    // Round 1 is the bottom row, as charts are drawn.
    rowY: (i) => top + (n - 1 - i) * cell,
    colX: (x) => left + x * cell,
    legendTop: top + gridHeight + 34,
  };
}

/**
 * <defs>: one group per symbol used, drawn in currentColor at cell size
 * (placed with <use href="#sym-ID" x y color>), a cell-sized square `#cell`
 * (placed with <use href="#cell" x y fill>: it keeps the output small), and
 * the backing-stitch hatch.
 */
export function symbolDefs(ids: readonly SymbolId[], cell: number): string {
  const parts: string[] = [el('rect', { id: 'cell', width: cell, height: cell })];
  for (const id of ids) {
    const d = symbolDef(id);
    const paths: string[] = [];
    if (d.stroke) paths.push(el('path', { d: d.stroke, fill: 'none', stroke: 'currentColor', 'stroke-width': 0.09, 'stroke-linecap': 'round', 'stroke-linejoin': 'round' }));
    if (d.fill) paths.push(el('path', { d: d.fill, fill: 'currentColor' }));
    parts.push(el('g', { id: `sym-${id}`, transform: `scale(${cell})` }, paths.length ? paths : ''));
  }
  // Backing cells: a light diagonal hatch over the yarn colour says "behind the fabric".
  parts.push(el('pattern', { id: 'backing-hatch', width: 4, height: 4, patternUnits: 'userSpaceOnUse', patternTransform: 'rotate(45)' },
    el('rect', { width: 1.5, height: 4, fill: '#808080', 'fill-opacity': 0.45 })));
  return el('defs', {}, parts);
}

function headingLines(model: ChartModel, view: string): [string, string] {
  const title = `${model.title ?? 'Untitled pattern'}, size ${model.size}: ${view}`;
  const word = model.construction === 'flat' ? 'rows' : 'rounds';
  const reading = view.startsWith('back')
    ? 'seen through the fabric, columns as on the front chart'
    : model.construction === 'flat'
      ? 'RS rows are read from right to left, WS rows from left to right'
      : 'every round is read from right to left';
  return [title, `${model.rows.length} ${word}, ${model.width} columns; ${reading}.`];
}

/** Title line and a subtitle. */
export function heading(model: ChartModel, frame: Frame, view: string): string {
  const [title, subtitle] = headingLines(model, view);
  return text({ x: 8, y: 18, 'font-size': 14, 'font-weight': 600 }, title)
    + text({ x: 8, y: 34, 'font-size': 10, fill: '#444444' }, subtitle);
}

/**
 * Width the heading needs so a narrow chart does not cut its title off: about
 * 8.2 px per character of the 14 px bold title and 5.6 px at 10 px, as legendWidth.
 */
export function headingWidth(model: ChartModel, view: string): number {
  const [title, subtitle] = headingLines(model, view);
  return Math.max(title.length * 8.2, subtitle.length * 5.6);
}

/** Round/row numbers beside the grid, on the side each is read from. */
export function rowNumbers(model: ChartModel, frame: Frame): string {
  const parts: string[] = [];
  model.rows.forEach((row: ChartRow, i) => {
    const y = frame.rowY(i) + frame.cell * 0.72;
    const onRight = row.readFrom === 'right';
    parts.push(text({
      x: onRight ? frame.left + frame.gridWidth + 5 : frame.left - 5, y, 'font-size': Math.min(10, frame.cell * 0.65),
      'text-anchor': onRight ? 'start' : 'end', 'data-round': row.number, 'data-side': row.side,
    }, String(row.number)));
  });
  return el('g', { class: 'row-numbers', fill: '#222222' }, parts);
}

/** Stitch numbers under the grid, counted from the right edge where RS rows start, every 5 columns. */
export function columnNumbers(model: ChartModel, frame: Frame): string {
  const parts: string[] = [];
  for (let fromRight = 1; fromRight <= model.width; fromRight++) {
    if (fromRight !== 1 && fromRight % 5 !== 0) continue;
    const x = model.width - fromRight;
    parts.push(text({ x: frame.colX(x) + frame.cell / 2, y: frame.top + frame.gridHeight + 12, 'font-size': 8, 'text-anchor': 'middle' }, String(fromRight)));
  }
  return el('g', { class: 'column-numbers', fill: '#555555' }, parts);
}

/** Marker lines per row and each marker's name above the grid where it was last seen. */
export function markerLines(model: ChartModel, frame: Frame): string {
  const lines: string[] = [];
  const lastSeen = new Map<string, { x: number; row: number }>();
  model.rows.forEach((row, i) => {
    for (const m of row.markers) {
      const x = frame.colX(m.x);
      const y = frame.rowY(i);
      lines.push(el('line', { x1: x, y1: y, x2: x, y2: y + frame.cell, stroke: '#c0392b', 'stroke-width': 2.5, 'data-marker': m.name, 'data-round': row.number }));
      lastSeen.set(m.name, { x: m.x, row: i });
    }
  });
  const labels: string[] = [];
  // Names of markers close together are stacked so they stay readable.
  const placed: { x: number; level: number }[] = [];
  for (const [name, at] of [...lastSeen].sort((a, b) => a[1].x - b[1].x)) {
    const x = frame.colX(at.x);
    let level = 0;
    while (placed.some((p) => p.level === level && Math.abs(p.x - x) < 40)) level++;
    placed.push({ x, level });
    labels.push(text({ x, y: frame.top - 3 - level * 9, 'font-size': 9, 'text-anchor': 'middle', fill: '#c0392b' }, name));
  }
  return el('g', { class: 'markers' }, [...lines, ...labels]);
}

/** The legend: one line per symbol used, then one per yarn. Returns the SVG and its height. */
export function legend(model: ChartModel, frame: Frame, extra: readonly { swatch: string; label: string }[] = [], noStitchFill = NO_STITCH_FILL): { svg: string; height: number } {
  const parts: string[] = [];
  let y = frame.legendTop;
  const x = 8;
  const box = frame.cell;
  parts.push(text({ x, y: y - 8, 'font-size': 11, 'font-weight': 600 }, 'Key'));
  for (const id of model.legend) {
    const d = symbolDef(id);
    parts.push(el('rect', { x, y, width: box, height: box, fill: id === 'no-stitch' ? noStitchFill : '#ffffff', stroke: '#777777', 'stroke-width': 0.6 }));
    if (id !== 'no-stitch' && id !== 'knit') parts.push(el('use', { href: `#sym-${id}`, x, y, color: '#000000' }));
    const label = d.abbreviation ? `${d.abbreviation}: ${d.meaning}` : d.meaning;
    parts.push(text({ x: x + box + 6, y: y + box - 3, 'font-size': 10 }, label));
    y += box + 5;
  }
  for (const yarn of model.yarns) {
    parts.push(el('rect', { x, y, width: box, height: box, fill: yarn.colour, stroke: '#777777', 'stroke-width': 0.6 }));
    parts.push(text({ x: x + box + 6, y: y + box - 3, 'font-size': 10 }, `${yarn.name}: ${yarn.label} (${yarn.colour})`));
    y += box + 5;
  }
  for (const e of extra) {
    parts.push(el('rect', { x, y, width: box, height: box, fill: e.swatch, stroke: '#777777', 'stroke-width': 0.6 }));
    parts.push(text({ x: x + box + 6, y: y + box - 3, 'font-size': 10 }, e.label));
    y += box + 5;
  }
  return { svg: el('g', { class: 'legend' }, parts), height: y - frame.legendTop + 8 };
}

/** Fill of a no-stitch cell. */
export const NO_STITCH_FILL = '#c8c8c8';

/** Width a legend needs: the longest label at about 5.6 px per character at 10 px. */
export function legendWidth(model: ChartModel): number {
  let longest = 0;
  for (const id of model.legend) {
    const d = symbolDef(id);
    longest = Math.max(longest, d.abbreviation.length + d.meaning.length + 2);
  }
  for (const y of model.yarns) longest = Math.max(longest, y.name.length + y.label.length + 14);
  return 28 + longest * 5.6;
}

/** Data attributes that tie a drawn cell to its source (click-to-source). */
export function spanAttrs(span: { from: number; to: number } | null): Record<string, number | null> {
  return span ? { 'data-from': span.from, 'data-to': span.to } : { 'data-from': null, 'data-to': null };
}

