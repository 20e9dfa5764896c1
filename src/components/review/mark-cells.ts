/**
 * Marks a diff's changed chart cells on a chart SVG drawn by shared/render.
 *
 * The diff counts a cell as the n-th FRONT stitch from the chart's right
 * edge (backing stitches take no width there); the SVG's cells carry
 * data-stitch in working order, backing ones with class "backing", inside
 * row groups carrying data-round. So within a row, the front stitch cells
 * sorted by x from the right give the diff's numbering, for rounds and for
 * flat rows alike (the diff turns WS rows to the chart's positions).
 */

/** A cell to mark: round (row) number and 1-based front stitch from the right edge. */
export interface CellMark { round: number; stitch: number }

const SVG_NS = 'http://www.w3.org/2000/svg';

function xOf(el: Element): number {
  return Number(el.getAttribute('x') ?? el.firstElementChild?.getAttribute('x') ?? NaN);
}
function yOf(el: Element): number {
  return Number(el.getAttribute('y') ?? el.firstElementChild?.getAttribute('y') ?? NaN);
}

/**
 * Draws an outline over each marked cell and a bar beside each marked row,
 * in one overlay group appended to `svg` (removed again by the returned
 * function). Cells it cannot find are counted in `missed`.
 */
export function markCells(svg: SVGSVGElement, cells: CellMark[], rows: number[]): { missed: number; undo: () => void } {
  const size = Number(svg.querySelector('#cell')?.getAttribute('width') ?? 16);
  const overlay = document.createElementNS(SVG_NS, 'g');
  overlay.setAttribute('class', 'lw-diff-marks');
  overlay.setAttribute('pointer-events', 'none');
  const byRound = new Map<number, Element[]>();
  const rowCells = (round: number): Element[] => {
    let list = byRound.get(round);
    if (!list) {
      const row = svg.querySelector(`g.row[data-round="${round}"]`);
      list = row ? [...row.children].filter((c) => c.hasAttribute('data-stitch') && !c.classList.contains('backing')).sort((a, b) => xOf(b) - xOf(a)) : [];
      byRound.set(round, list);
    }
    return list;
  };
  const rect = (x: number, y: number, w: number, h: number, cls: string) => {
    const r = document.createElementNS(SVG_NS, 'rect');
    r.setAttribute('x', String(x)); r.setAttribute('y', String(y));
    r.setAttribute('width', String(w)); r.setAttribute('height', String(h));
    r.setAttribute('class', cls);
    overlay.append(r);
  };
  for (const round of rows) {
    const list = rowCells(round);
    if (!list.length) continue;
    const xs = list.map(xOf);
    const left = Math.min(...xs), right = Math.max(...xs) + size;
    rect(left - 3, yOf(list[0]) + 1, 2, size - 2, 'lw-diff-row');
    rect(right + 1, yOf(list[0]) + 1, 2, size - 2, 'lw-diff-row');
  }
  let missed = 0;
  for (const c of cells) {
    const el = rowCells(c.round)[c.stitch - 1];
    if (!el) { missed++; continue; }
    rect(xOf(el) + 1, yOf(el) + 1, size - 2, size - 2, 'lw-diff-cell');
  }
  svg.append(overlay);
  return { missed, undo: () => overlay.remove() };
}

/**
 * Scrolls `box` (a scrolling container) so `target` sits in its middle
 * (with `horizontally` false: at its height, the right edge in view),
 * without scrolling the page around it (scrollIntoView would move every
 * scrolling ancestor, the page included).
 */
export function centreWithin(box: HTMLElement, target: Element, horizontally = true): void {
  const b = box.getBoundingClientRect();
  const t = target.getBoundingClientRect();
  box.scrollTop += t.top - b.top - (b.height - t.height) / 2;
  // Otherwise show the right edge, where rounds start.
  if (horizontally) box.scrollLeft += t.left - b.left - (b.width - t.width) / 2;
  else box.scrollLeft = box.scrollWidth;
}
