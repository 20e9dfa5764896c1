/**
 * Wires a {@link ChartGrid} to the element that holds a chart SVG: one
 * delegated keydown / focusin / focusout listener on that element (never one
 * per cell), a fresh grid for each new drawing that keeps the tab stop on
 * the same round and column, and the focus ring (drawn in the holder, which
 * must be positioned, e.g. Tailwind `relative`).
 *
 * Enter or Space on a cell calls `onActivate(cell)`, which should do what a
 * click on that cell does; `onFocusCell(name)` hears the name of each cell
 * the keyboard reaches (for a status line).
 */
import { useCallback, useEffect, useRef, type RefObject } from 'react';
import { ChartGrid, isGridKey, type ChartGridOptions, type GridSpot } from './chart-grid';

export interface UseChartGridOptions extends ChartGridOptions {
  /** Changes whenever a new SVG is in the holder (e.g. the SVG string itself); null: nothing drawn. */
  drawing: string | null;
  /** Round whose stitch 1 takes the tab stop, now and whenever it changes while the grid is not focused (default: the first round). */
  startRound?: number | null;
  onActivate: (cell: Element) => void;
  onFocusCell?: (name: string | null) => void;
}

/** Makes the chart in `holder` a keyboard grid. Returns `select(cell)`, to move the tab stop on a click. */
export function useChartGrid(holder: RefObject<HTMLElement | null>, opts: UseChartGridOptions): { select: (cell: Element) => void } {
  const grid = useRef<ChartGrid | null>(null);
  const spot = useRef<GridSpot | null>(null);
  const focused = useRef(false);
  const latest = useRef(opts);
  useEffect(() => { latest.current = opts; });
  const { drawing, word, label, hint } = opts;
  // By content: a new compile hands over an equal list as a new array, which must not rebuild the grid.
  const yarnKey = JSON.stringify(opts.yarns ?? null);

  // A new drawing: a new grid, with the tab stop where it was (and the focus, if the grid had it).
  // The grid's name and the start round are read when it is made, so changing them (the knitter's
  // current round) does not rebuild the grid under the focused cell.
  useEffect(() => {
    const svg = holder.current?.querySelector('svg');
    grid.current = null;
    if (!svg || !drawing) return;
    const g = new ChartGrid(svg, { word, label: latest.current.label, hint, yarns: latest.current.yarns });
    g.ringHost = holder.current;
    if (!g.init(spot.current, latest.current.startRound ?? null)) return;
    grid.current = g;
    if (focused.current && g.activeCell && (!document.activeElement || document.activeElement === document.body)) g.focus(g.activeCell);
    return () => { spot.current = g.spot() ?? spot.current; g.release(); };
  }, [holder, drawing, word, hint, yarnKey]);

  useEffect(() => { grid.current?.setLabel(label); }, [label, drawing]);

  // A new start round (the knitter's current round moved on) takes the tab stop along, unless the keyboard is in the grid.
  const { startRound = null } = opts;
  useEffect(() => {
    const g = grid.current;
    if (!g || focused.current || startRound === null) return;
    g.startAt(startRound);
    spot.current = g.spot();
  }, [startRound, drawing]);

  useEffect(() => {
    const el = holder.current;
    if (!el) return;
    const onKey = (e: KeyboardEvent) => {
      const g = grid.current;
      const target = e.target as Element;
      if (!g || !g.owns(target) || e.altKey || e.metaKey) return;
      if (e.key === 'Enter' || e.key === ' ') {
        e.preventDefault();
        latest.current.onActivate(target);
        return;
      }
      if (!isGridKey(e.key)) return;
      e.preventDefault();
      const next = g.move(e.key, e.ctrlKey);
      if (!next) return;
      g.focus(next);
      spot.current = g.spot();
      latest.current.onFocusCell?.(next.getAttribute('aria-label'));
    };
    const onFocusIn = (e: FocusEvent) => {
      const g = grid.current;
      const target = e.target as Element;
      if (!g || !g.owns(target)) return;
      focused.current = true;
      g.prepare();
      // Preparing the back view gathers its cells into row groups; moving the focused cell drops its focus.
      if (document.activeElement !== target) { g.focus(target); return; }
      g.showRing(target);
      latest.current.onFocusCell?.(target.getAttribute('aria-label'));
    };
    const onFocusOut = (e: FocusEvent) => {
      const to = e.relatedTarget as Element | null;
      if (to && grid.current?.owns(to)) return;
      focused.current = false;
      grid.current?.hideRing();
      if (grid.current?.owns(e.target as Element)) latest.current.onFocusCell?.(null);
    };
    el.addEventListener('keydown', onKey);
    el.addEventListener('focusin', onFocusIn);
    el.addEventListener('focusout', onFocusOut);
    return () => {
      el.removeEventListener('keydown', onKey);
      el.removeEventListener('focusin', onFocusIn);
      el.removeEventListener('focusout', onFocusOut);
    };
  }, [holder]);

  const select = useCallback((cell: Element) => {
    const g = grid.current;
    if (!g || !g.owns(cell)) return;
    g.setActive(cell);
    spot.current = g.spot();
  }, []);
  return { select };
}
