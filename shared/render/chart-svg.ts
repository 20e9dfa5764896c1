/**
 * The front chart as SVG: one cell per stitch in its yarn colour, the
 * stitch's symbol in black or white ink (whichever contrasts more with the
 * yarn), backing stitches hatched, no-stitch cells grey, markers as red
 * lines, round/row numbers on the side each is read from, and a legend of
 * the symbols used. Every stitch cell carries data-from/data-to (its source
 * span, UTF-16 offsets, `to` exclusive) and data-stitch (1-based, in working
 * order); its row group carries data-round: enough for click-to-source.
 *
 * Output is a complete, well-formed SVG document (all text escaped).
 */
import type { ChartModel } from './chart-model';
import { columnNumbers, frameFor, heading, headingWidth, legend, legendWidth, markerLines, NO_STITCH_FILL, rowNumbers, spanAttrs, symbolDefs, type ChartDrawOptions } from './chart-frame';
import { el, svgDocument } from './svg';

const FRONT_VIEW = 'chart, front (right side)';

/** Draws the front of the work (as seen on the right side). */
export function renderChartSvg(model: ChartModel, options: ChartDrawOptions = {}): string {
  const frame = frameFor(model, options, Math.max(legendWidth(model), headingWidth(model, FRONT_VIEW)));
  const c = frame.cell;
  const rows: string[] = [];
  model.rows.forEach((row, i) => {
    const y = frame.rowY(i);
    const cells: string[] = [];
    row.cells.forEach((cell, x) => {
      const cx = frame.colX(x);
      if (!cell) {
        cells.push(el('use', { href: '#cell', x: cx, y, fill: NO_STITCH_FILL }));
        return;
      }
      const data = { 'data-stitch': cell.isBoundOff ? null : cell.stitch + 1, ...spanAttrs(cell.span) };
      if (cell.symbol === 'knit' && !cell.isBacking) {
        cells.push(el('use', { href: '#cell', x: cx, y, fill: cell.colour, ...data }));
        return;
      }
      const parts = [el('use', { href: '#cell', x: cx, y, fill: cell.colour })];
      if (cell.isBacking) parts.push(el('use', { href: '#cell', x: cx, y, fill: 'url(#backing-hatch)' }));
      if (cell.symbol !== 'knit') parts.push(el('use', { href: `#sym-${cell.symbol}`, x: cx, y, color: cell.ink }));
      cells.push(el('g', { class: cell.isBacking ? 'backing' : null, ...data }, parts));
    });
    rows.push(el('g', { class: 'row', 'data-round': row.number, 'data-side': row.side }, cells));
  });
  const grid = gridLines(model.width, model.rows.length, frame);
  const key = legend(model, frame);
  const height = frame.legendTop + key.height;
  const title = `${model.title ?? 'Untitled pattern'}, size ${model.size}: chart, front`;
  return svgDocument(frame.width, height, title, [
    symbolDefs(model.legend, c),
    el('rect', { x: 0, y: 0, width: frame.width, height, fill: '#ffffff' }),
    heading(model, frame, FRONT_VIEW),
    el('g', { class: 'cells' }, rows),
    grid,
    markerLines(model, frame),
    rowNumbers(model, frame),
    columnNumbers(model, frame),
    key.svg,
  ]);
}

/** Thin cell lines, and a darker line every 10 columns (from the right) and 10 rows. */
export function gridLines(width: number, rows: number, frame: ReturnType<typeof frameFor>): string {
  const c = frame.cell;
  let thin = '';
  let thick = '';
  for (let x = 0; x <= width; x++) {
    const px = frame.colX(x);
    const seg = `M${px} ${frame.top}V${frame.top + frame.gridHeight}`;
    if ((width - x) % 10 === 0 || x === 0) thick += seg; else thin += seg;
  }
  for (let r = 0; r <= rows; r++) {
    const py = frame.top + r * c;
    const seg = `M${frame.left} ${py}H${frame.left + frame.gridWidth}`;
    if ((rows - r) % 10 === 0 || r === 0) thick += seg; else thin += seg;
  }
  return el('g', { class: 'grid', fill: 'none' }, [
    thin ? el('path', { d: thin, stroke: '#8a8a8a', 'stroke-width': 0.5 }) : '',
    thick ? el('path', { d: thick, stroke: '#333333', 'stroke-width': 1 }) : '',
  ]);
}
