/**
 * The chart of a release in one size with the knitter's current round
 * shaded and outlined; clicking a round makes it the current one. The chart
 * is also a keyboard grid (components/chart/useChartGrid.ts): one tab stop,
 * starting on the current round; Enter or Space makes the focused cell's
 * round the current one.
 */
import { useEffect, useRef } from 'react';
import { useChartGrid } from '../chart/useChartGrid';
import { centreWithin } from '../review/mark-cells';

const SVG_NS = 'http://www.w3.org/2000/svg';

/** Shades row `round` of a chart SVG from shared/render; returns the undo. */
function shadeRow(svg: SVGSVGElement, round: number): () => void {
  const row = svg.querySelector(`g.row[data-round="${round}"]`);
  const cells = row ? [...row.children] : [];
  if (!cells.length) return () => {};
  const size = Number(svg.querySelector('#cell')?.getAttribute('width') ?? 16);
  const pos = (el: Element, a: 'x' | 'y') => Number(el.getAttribute(a) ?? el.firstElementChild?.getAttribute(a) ?? 0);
  const xs = cells.map((c) => pos(c, 'x'));
  const r = document.createElementNS(SVG_NS, 'rect');
  r.setAttribute('x', String(Math.min(...xs) - 1));
  r.setAttribute('y', String(pos(cells[0], 'y') - 1));
  r.setAttribute('width', String(Math.max(...xs) - Math.min(...xs) + size + 2));
  r.setAttribute('height', String(size + 2));
  r.setAttribute('class', 'lw-current-row');
  r.setAttribute('pointer-events', 'none');
  svg.append(r);
  return () => r.remove();
}

export function KnitChart({ svg, current, word, onPick }: { svg: string | null; current: number | null; word: 'Round' | 'Row'; onPick: (round: number) => void }) {
  const box = useRef<HTMLDivElement>(null);
  useEffect(() => {
    const el = box.current?.querySelector('svg');
    if (!el || current === null) return;
    const undo = shadeRow(el, current);
    const mark = el.querySelector('.lw-current-row');
    if (box.current && mark) centreWithin(box.current, mark, false);
    return undo;
  }, [svg, current]);
  const roundOf = (el: Element) => Number(el.closest('[data-round]')?.getAttribute('data-round') ?? NaN);
  const lower = word.toLowerCase();
  const { select } = useChartGrid(box, {
    drawing: svg,
    word,
    startRound: current,
    label: `Chart; the current ${lower}${current ? ` (${current})` : ''} is outlined`,
    hint: `Enter: make this ${lower} the current one.`,
    onActivate: (cell) => { const r = roundOf(cell); if (Number.isFinite(r)) onPick(r); },
  });
  if (!svg) return null;
  return (
    <div ref={box} className="lw-chart relative max-h-[32rem] overflow-auto bg-tide-50 p-3" data-testid="knit-chart"
      onClick={(e) => {
        const target = e.target as Element;
        const r = roundOf(target);
        if (!Number.isFinite(r)) return;
        const cell = target.closest('g.row > *, g.backing');
        if (cell) select(cell);
        onPick(r);
      }}>
      <div className="inline-block rounded-stitch border border-tide-200 bg-white" dangerouslySetInnerHTML={{ __html: svg }} />
      <p className="sr-only">Click a {lower}, or Tab into the chart and use the arrow keys and Enter, to make it current.</p>
    </div>
  );
}
