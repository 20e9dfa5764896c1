/**
 * The part of the chart grid that every drawing needs at once: the grid
 * role, its name and the one tab stop, placed in O(1) of the chart's size
 * (O(rounds) at most). Everything else (moving, naming every cell, the
 * focus ring) is in chart-grid.ts, loaded when the keyboard or the mouse
 * first reaches a chart, since most visits never use it.
 *
 * Reads the structure of shared/render's chart SVG: `g.cells` holds one
 * `g.row[data-round]` per round (front view, one child per column) or the
 * `g.backing[data-round]` cells of backing stitches (back view).
 */

/** Where the tab stop is, kept across redraws: round number and column on screen (0 = leftmost). */
export interface GridSpot { round: number; column: number }

/** x or y of a cell (a <use>, or a <g> whose first child is placed). */
export const num = (el: Element, a: 'x' | 'y'): number => Number(el.getAttribute(a) ?? el.firstElementChild?.getAttribute(a) ?? NaN);
/** The round (row) number a cell belongs to. */
export const roundOf = (el: Element): number => Number(el.closest('[data-round]')?.getAttribute('data-round') ?? NaN);
/** A stitch cell (as opposed to a no-stitch cell): it carries its stitch number or its source span. */
export const isStitchCell = (el: Element): boolean => el.hasAttribute('data-stitch') || el.hasAttribute('data-from');

/** True when the drawing is the back view (its cell group does not start with a row). */
export function isBackView(group: Element): boolean {
  return !group.firstElementChild?.matches('g.row');
}

/**
 * The cell for the tab stop: the one at `spot` when it still exists, else
 * stitch 1 of `round` (or of the first round); in the back view the first
 * backing cell of that round.
 */
export function findCell(group: Element, spot: GridSpot | null, round: number | null): Element | null {
  if (isBackView(group)) {
    const cells = group.querySelectorAll(':scope > g.backing[data-round], :scope > g[role="row"] > g.backing');
    const want = spot?.round ?? round;
    if (want !== null) for (const c of cells) if (roundOf(c) === want) return c;
    return cells[0] ?? null;
  }
  // Rows are direct children of the group: walking them is O(rounds), where a selector would visit every cell.
  const rowOf = (n: number | null): Element | null => {
    if (n === null) return null;
    for (const row of group.children) if (row.getAttribute('data-round') === String(n)) return row;
    return null;
  };
  const spotRow = spot ? rowOf(spot.round) : null;
  if (spot && spotRow?.children.length) return spotRow.children[Math.min(spot.column, spotRow.children.length - 1)]!;
  const row = rowOf(round) ?? group.firstElementChild;
  if (!row) return null;
  return row.querySelector(':scope > [data-stitch="1"]') ?? [...row.children].find(isStitchCell) ?? row.firstElementChild;
}

/** Makes `cell` the tab stop (a named gridcell in a row) and takes it from `previous`. */
export function markTabStop(cell: Element, group: Element, previous: Element | null, name: string): void {
  if (previous && previous !== cell) previous.removeAttribute('tabindex');
  cell.setAttribute('tabindex', '0');
  // Only real changes: every touched attribute that a style rule reads costs a repaint of the whole drawing.
  if (cell.getAttribute('role') !== 'gridcell') cell.setAttribute('role', 'gridcell');
  const row = cell.parentElement;
  // Back view before the grid is prepared: the cell still sits directly in the grid group, which keeps its role.
  if (row && row !== group && row.getAttribute('role') !== 'row') row.setAttribute('role', 'row');
  cell.setAttribute('aria-label', name);
}

/**
 * Marks `svg` as a grid named `label` and places the tab stop (see
 * {@link findCell}). Returns the tab-stop cell, or null when the drawing has
 * no cells (then nothing is marked).
 */
export function placeTabStop(svg: SVGSVGElement, label: string, word: string, spot: GridSpot | null, round: number | null): Element | null {
  const group = svg.querySelector('g.cells');
  if (!group) return null;
  const cell = findCell(group, spot, round);
  if (!cell) return null;
  svg.setAttribute('role', 'group');
  group.setAttribute('role', 'grid');
  group.setAttribute('aria-label', label);
  // A plain name until chart-grid.ts gives the full one (it is loaded before the keyboard usually gets here).
  markTabStop(cell, group, null, `${word} ${roundOf(cell)}`);
  return cell;
}
