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
import { columnNumbers, frameFor, heading, headingWidth, legend, legendWidth, markerLines, rowNumbers, spanAttrs, symbolDefs, type ChartDrawOptions } from './chart-frame';
import { gridLines } from './chart-svg';
import { el, num, svgDocument, text } from './svg';

const OVER = '#d62728';
const BACK_NO_STITCH = '#9a9a9a';

const BACK_VIEW = 'back of the work';

/** Draws the back of the work: backing columns and floats. */
export function renderBackSvg(model: ChartModel, options: ChartDrawOptions = {}): string {
  const frame = frameFor(model, options, Math.max(legendWidth(model), 28 + 90 * 5.6, headingWidth(model, BACK_VIEW)));
  const c = frame.cell;
  const cells: string[] = [];
  const floats: string[] = [];
  const yarnIndex = new Map(model.yarns.map((y, i) => [y.name, i]));
  const yarnCount = Math.max(1, model.yarns.length);
  let overCount = 0;
  // The grid is white; front stitches show only a strip of their yarn, merged along a row, so backing columns and floats stand out.
  cells.push(el('rect', { x: frame.left, y: frame.top, width: frame.gridWidth, height: frame.gridHeight, fill: '#ffffff' }));
  model.rows.forEach((row, i) => {
    const y = frame.rowY(i);
    let x = 0;
    while (x < row.cells.length) {
      const cell = row.cells[x];
      let run = 1;
      const key = (k: number) => { const q = row.cells[k]; return !q ? 'none' : q.isBacking ? `b${k}` : q.colour; };
      while (x + run < row.cells.length && key(x + run) === key(x) && !cell?.isBacking) run++;
      const cx = frame.colX(x);
      if (!cell) cells.push(el('rect', { x: cx, y, width: run * c, height: c, fill: BACK_NO_STITCH }));
      else if (!cell.isBacking) cells.push(el('rect', { x: cx, y: y + c * 0.86, width: run * c, height: c * 0.14, fill: cell.colour }));
      else {
        cells.push(el('g', { class: 'backing', 'data-round': row.number, 'data-stitch': cell.stitch + 1, ...spanAttrs(cell.span) }, [
          el('use', { href: '#cell', x: cx, y, fill: cell.colour, stroke: '#000000', 'stroke-width': 1 }),
          el('use', { href: `#sym-${cell.symbol}`, x: cx, y, color: cell.ink }),
        ]));
      }
      x += run;
    }
    // Ordinary floats of one yarn in a row share one path (dark underline first, so pale yarns show on white).
    const plain = new Map<string, { colour: string; d: string; fy: number }>();
    const labels: string[] = [];
    for (const f of row.floats) {
      const yi = yarnIndex.get(f.yarn) ?? 0;
      // Yarns float at different heights within the row so they do not hide each other.
      const fy = y + c * (yarnCount === 1 ? 0.5 : 0.3 + (0.4 * yi) / (yarnCount - 1));
      const d = f.pieces.map((p) => `M${num(frame.colX(p.x1) + 2)} ${num(fy)}H${num(frame.colX(p.x2 + 1) - 2)}`).join('');
      const widest = f.pieces.reduce((a, b) => (b.x2 - b.x1 > a.x2 - a.x1 ? b : a));
      const shown = f.isCaught ? `≤${f.caughtLongest}` : f.stitches >= 2 ? String(f.stitches) : '';
      const lx = (frame.colX(widest.x1) + frame.colX(widest.x2 + 1)) / 2;
      if (f.isOverLimit || f.isCaught) {
        if (f.isOverLimit) overCount++;
        floats.push(el('g', { class: f.isOverLimit ? 'float over-limit' : 'float caught', 'data-round': row.number, 'data-yarn': f.yarn, 'data-stitches': f.stitches }, [
          el('path', { d, stroke: f.isOverLimit ? OVER : f.colour, 'stroke-width': f.isOverLimit ? 3 : 1.8, 'stroke-linecap': 'round', 'stroke-dasharray': f.isCaught ? '3 2' : null }),
          text({ x: lx, y: fy - 2, 'font-size': Math.min(9, c * 0.55), 'text-anchor': 'middle', fill: f.isOverLimit ? OVER : '#111111', 'font-weight': f.isOverLimit ? 700 : null }, shown),
        ]));
        continue;
      }
      const entry = plain.get(f.yarn) ?? { colour: f.colour, d: '', fy };
      entry.d += d;
      plain.set(f.yarn, entry);
      if (shown) labels.push(text({ x: lx, y: fy - 2 }, shown));
    }
    for (const [yarn, p] of plain) {
      floats.push(el('g', { class: 'float', 'data-round': row.number, 'data-yarn': yarn, fill: 'none', 'stroke-linecap': 'round' }, [
        el('path', { d: p.d, stroke: '#000000', 'stroke-opacity': 0.55, 'stroke-width': 2.8 }),
        el('path', { d: p.d, stroke: p.colour, 'stroke-width': 1.8 }),
      ]));
    }
    if (labels.length) floats.push(el('g', { class: 'float-lengths', 'font-size': Math.min(9, c * 0.55), 'text-anchor': 'middle', fill: '#111111' }, labels));
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
    symbolDefs(backSymbols, c),
    el('rect', { x: 0, y: 0, width: frame.width, height, fill: '#ffffff' }),
    heading(model, frame, BACK_VIEW),
    el('g', { class: 'cells' }, cells),
    gridLines(model.width, model.rows.length, frame),
    el('g', { class: 'floats' }, floats),
    markerLines(model, frame),
    rowNumbers(model, frame),
    columnNumbers(model, frame),
    key.svg,
  ]);
}
