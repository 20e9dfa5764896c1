/**
 * The back-of-work view as SVG. Drawn in the same orientation as the front
 * chart (columns line up with it, as if seen through the fabric), so a
 * designer can compare the two: front stitches are pale, backing stitches
 * are drawn in their yarn (with the backing symbols), and every float is a
 * line in its yarn across the stitches it passes, labelled with its length
 * in stitches. Floats longer than the limit are drawn red and thick, with
 * their length in red.
 */
import type { ChartModel } from './chart-model';
import { columnNumbers, frameFor, heading, legend, legendWidth, markerLines, rowNumbers, spanAttrs, symbolDefs, type ChartDrawOptions } from './chart-frame';
import { gridLines } from './chart-svg';
import { el, svgDocument, text } from './svg';

const OVER = '#d62728';
const BACK_NO_STITCH = '#9a9a9a';

/** Draws the back of the work: backing columns and floats. */
export function renderBackSvg(model: ChartModel, options: ChartDrawOptions = {}): string {
  const frame = frameFor(model, options, Math.max(legendWidth(model), 28 + 90 * 5.6));
  const c = frame.cell;
  const cells: string[] = [];
  const floats: string[] = [];
  const yarnIndex = new Map(model.yarns.map((y, i) => [y.name, i]));
  const yarnCount = Math.max(1, model.yarns.length);
  let overCount = 0;
  model.rows.forEach((row, i) => {
    const y = frame.rowY(i);
    row.cells.forEach((cell, x) => {
      const cx = frame.colX(x);
      if (!cell) { cells.push(el('rect', { x: cx, y, width: c, height: c, fill: BACK_NO_STITCH })); return; }
      if (!cell.isBacking) {
        // Front stitch: white with a strip of its yarn, so backing columns and floats stand out.
        cells.push(el('rect', { x: cx, y, width: c, height: c, fill: '#ffffff' }));
        cells.push(el('rect', { x: cx, y: y + c * 0.8, width: c, height: c * 0.2, fill: cell.colour }));
        return;
      }
      cells.push(el('g', { class: 'cell backing', 'data-round': row.number, 'data-stitch': cell.stitch + 1, 'data-yarn': cell.yarn, ...spanAttrs(cell.span) }, [
        el('rect', { x: cx, y, width: c, height: c, fill: cell.colour, stroke: '#000000', 'stroke-width': 1 }),
        el('use', { href: `#sym-${cell.symbol}`, x: cx, y, width: c, height: c, color: cell.ink }),
      ]));
    });
    for (const f of row.floats) {
      const yi = yarnIndex.get(f.yarn) ?? 0;
      // Yarns float at different heights within the row so they do not hide each other.
      const fy = y + c * (yarnCount === 1 ? 0.5 : 0.3 + (0.4 * yi) / (yarnCount - 1));
      if (f.isOverLimit) overCount++;
      const lines = f.pieces.map((p) => {
        const x1 = frame.colX(p.x1) + 2, x2 = frame.colX(p.x2 + 1) - 2;
        return el('line', {
          x1, y1: fy, x2, y2: fy, stroke: f.isOverLimit ? OVER : f.colour, 'stroke-width': f.isOverLimit ? 3 : 1.8, 'stroke-linecap': 'round',
          'stroke-dasharray': f.isCaught ? '3 2' : null,
        });
      });
      // A dark underline keeps pale yarns visible on white.
      const under = f.isOverLimit ? [] : f.pieces.map((p) => el('line', {
        x1: frame.colX(p.x1) + 2, y1: fy, x2: frame.colX(p.x2 + 1) - 2, y2: fy, stroke: '#000000', 'stroke-opacity': 0.55, 'stroke-width': 2.8, 'stroke-linecap': 'round',
      }));
      const widest = f.pieces.reduce((a, b) => (b.x2 - b.x1 > a.x2 - a.x1 ? b : a));
      const shown = f.isCaught ? `≤${f.caughtLongest}` : f.stitches >= 2 ? String(f.stitches) : '';
      const label = shown === '' ? '' : text({
        x: (frame.colX(widest.x1) + frame.colX(widest.x2 + 1)) / 2, y: fy - 2, 'font-size': Math.min(9, c * 0.55), 'text-anchor': 'middle',
        fill: f.isOverLimit ? OVER : '#111111', 'font-weight': f.isOverLimit ? 700 : 400,
      }, shown);
      floats.push(el('g', {
        class: f.isOverLimit ? 'float over-limit' : 'float', 'data-round': row.number, 'data-yarn': f.yarn, 'data-stitches': f.stitches,
      }, [...under, ...lines, label]));
    }
  });
  const limitText = model.floatLimitStitches === null
    ? 'no gauge declared, so floats are not measured against a limit'
    : `floats longer than ${model.floatLimitStitches} stitches (the float limit at this gauge): ${overCount}`;
  // The back shows only the symbols of backing stitches.
  const onBack = new Set<string>(['no-stitch']);
  for (const row of model.rows) for (const cell of row.cells) if (cell?.isBacking) onBack.add(cell.symbol);
  const backSymbols = model.legend.filter((id) => onBack.has(id));
  const key = legend({ ...model, legend: backSymbols }, frame, [
    { swatch: '#ffffff', label: 'a line: a float behind the stitches it spans, numbered with its length in stitches from 2 up' },
    { swatch: '#ffffff', label: 'a dashed line marked ≤n: a float broken by catches, none longer than n stitches' },
    { swatch: OVER, label: limitText },
  ], BACK_NO_STITCH);
  const height = frame.legendTop + key.height;
  const title = `${model.title ?? 'Untitled pattern'}, size ${model.size}: back of the work`;
  return svgDocument(frame.width, height, title, [
    symbolDefs(backSymbols),
    el('rect', { x: 0, y: 0, width: frame.width, height, fill: '#ffffff' }),
    heading(model, frame, 'back of the work'),
    el('g', { class: 'cells' }, cells),
    gridLines(model.width, model.rows.length, frame),
    el('g', { class: 'floats' }, floats),
    markerLines(model, frame),
    rowNumbers(model, frame),
    columnNumbers(model, frame),
    key.svg,
  ]);
}
