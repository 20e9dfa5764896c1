/**
 * The front chart as SVG: one cell per stitch in its yarn colour, the
 * stitch's symbol in black or white ink (whichever contrasts more with the
 * yarn), backing stitches hatched, no-stitch cells grey, markers as red
 * lines, round/row numbers on the side each is read from, and a legend of
 * the symbols used. Every stitch cell carries data-from/data-to/data-line
 * (its source span) plus data-round and data-stitch for click-to-source.
 *
 * Output is a complete, well-formed SVG document (all text escaped).
 */
import type { ChartModel } from './chart-model';
import { columnNumbers, frameFor, heading, legend, legendWidth, markerLines, NO_STITCH_FILL, rowNumbers, spanAttrs, symbolDefs, type ChartDrawOptions } from './chart-frame';
import { el, svgDocument } from './svg';

/** Draws the front of the work (as seen on the right side). */
export function renderChartSvg(model: ChartModel, options: ChartDrawOptions = {}): string {
  const frame = frameFor(model, options, legendWidth(model));
  const c = frame.cell;
  const cells: string[] = [];
  model.rows.forEach((row, i) => {
    const y = frame.rowY(i);
    row.cells.forEach((cell, x) => {
      const cx = frame.colX(x);
      if (!cell) {
        cells.push(el('rect', { x: cx, y, width: c, height: c, fill: NO_STITCH_FILL, class: 'no-stitch' }));
        return;
      }
      const parts = [el('rect', { x: cx, y, width: c, height: c, fill: cell.colour })];
      if (cell.isBacking) parts.push(el('rect', { x: cx, y, width: c, height: c, fill: 'url(#backing-hatch)' }));
      if (cell.symbol !== 'knit') parts.push(el('use', { href: `#sym-${cell.symbol}`, x: cx, y, width: c, height: c, color: cell.ink }));
      cells.push(el('g', {
        class: cell.isBacking ? 'cell backing' : 'cell', 'data-round': row.number, 'data-stitch': cell.isBoundOff ? null : cell.stitch + 1,
        'data-yarn': cell.yarn, ...spanAttrs(cell.span),
      }, parts));
    });
  });
  const grid = gridLines(model.width, model.rows.length, frame);
  const key = legend(model, frame);
  const height = frame.legendTop + key.height;
  const title = `${model.title ?? 'Untitled pattern'}, size ${model.size}: chart, front`;
  return svgDocument(frame.width, height, title, [
    symbolDefs(model.legend),
    el('rect', { x: 0, y: 0, width: frame.width, height, fill: '#ffffff' }),
    heading(model, frame, 'chart, front (right side)'),
    el('g', { class: 'cells' }, cells),
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
