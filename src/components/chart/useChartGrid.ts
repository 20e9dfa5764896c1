/**
 * Wires the chart grid to the element that holds a chart SVG: one
 * delegated keydown / focusin / focusout listener on that element (never one
 * per cell), the tab stop placed on every new drawing (on the same round
 * and column as before, with the focus if the grid had it), and the focus
 * ring (drawn in the holder, which must be positioned, e.g. Tailwind
 * `relative`).
 *
 * The grid's moving and naming code (chart-grid.ts) is not needed to show
 * a chart, so it is fetched once a chart is drawn and the page is idle (or
 * sooner, when the keyboard or a click reaches the chart); keys pressed
 * before it arrives wait for it. Once loaded, the focused cell is named in
 * the same task as the focus moves, before assistive technology reads it.
 *
 * Enter or Space on a cell calls `onActivate(cell)`, which should do what a
 * click on that cell does; `onFocusCell(name)` hears the name of each cell
 * the keyboard reaches (for a status line).
 */
import { useCallback, useEffect, useRef, type RefObject } from 'react';
import type { ChartGrid, ChartGridOptions } from './chart-grid';
import { placeTabStop, type GridSpot } from './tab-stop';

export interface UseChartGridOptions extends ChartGridOptions {
  /** Changes whenever a new SVG is in the holder (e.g. the SVG string itself); null: nothing drawn. */
  drawing: string | null;
  /** Round whose stitch 1 takes the tab stop, now and whenever it changes while the grid is not focused (default: the first round). */
  startRound?: number | null;
  onActivate: (cell: Element) => void;
  onFocusCell?: (name: string | null) => void;
}

let gridModule: Promise<typeof import('./chart-grid')> | null = null;
const loadGridModule = () => (gridModule ??= import('./chart-grid'));

/** The drawing in the holder now: its SVG and the cell holding the tab stop. */
interface Drawn { svg: SVGSVGElement; tabStop: Element; grid: ChartGrid | null }

/** Makes the chart in `holder` a keyboard grid. Returns `select(cell)`, to move the tab stop on a click. */
export function useChartGrid(holder: RefObject<HTMLElement | null>, opts: UseChartGridOptions): { select: (cell: Element) => void } {
  const drawn = useRef<Drawn | null>(null);
  const spot = useRef<GridSpot | null>(null);
  const focused = useRef(false);
  const latest = useRef(opts);
  useEffect(() => { latest.current = opts; });
  const { drawing, word, label, hint } = opts;
  // By content: a new compile hands over an equal list as a new array, which must not rebuild the grid.
  const yarnKey = JSON.stringify(opts.yarns);

  /** The grid of the current drawing, loading its module the first time. */
  const gridNow = useCallback(async (): Promise<ChartGrid | null> => {
    const d = drawn.current;
    if (!d) return null;
    if (d.grid) return d.grid;
    const { ChartGrid: Grid } = await loadGridModule();
    if (drawn.current !== d) return null; // redrawn meanwhile
    const o = latest.current;
    d.grid ??= new Grid(d.svg, { word: o.word, label: o.label, hint: o.hint, yarns: o.yarns }, d.tabStop);
    d.grid.ringHost = holder.current;
    return d.grid;
  }, [holder]);

  // A new drawing: the tab stop where it was (and the focus, if the grid had it).
  // The grid's name and the start round are read here, so changing them (the knitter's
  // current round) does not rebuild the grid under the focused cell.
  useEffect(() => {
    const svg = holder.current?.querySelector('svg');
    drawn.current = null;
    if (!svg || !drawing) return;
    const tabStop = placeTabStop(svg, latest.current.label, word, spot.current, latest.current.startRound ?? null);
    if (!tabStop) return;
    const d: Drawn = { svg, tabStop, grid: null };
    drawn.current = d;
    // Safari has no requestIdleCallback: there the module comes on the next turn.
    if (!gridModule) (window.requestIdleCallback ?? setTimeout)(() => void loadGridModule());
    if (focused.current && (!document.activeElement || document.activeElement === document.body)) (tabStop as SVGElement).focus();
    return () => {
      spot.current = d.grid?.spot() ?? spot.current;
      if (d.grid) d.grid.release(); else d.tabStop.removeAttribute('tabindex');
    };
  }, [holder, drawing, word, hint, yarnKey]);

  useEffect(() => { drawn.current?.svg.querySelector('g.cells')?.setAttribute('aria-label', label); }, [label, drawing]);

  // A new start round (the knitter's current round moved on) takes the tab stop along, unless the keyboard is in the grid.
  const { startRound = null } = opts;
  useEffect(() => {
    if (startRound === null) return;
    void gridNow().then((g) => {
      if (!g || focused.current) return;
      g.startAt(startRound);
      spot.current = g.spot();
    });
  }, [startRound, drawing, gridNow]);

  useEffect(() => {
    const el = holder.current;
    if (!el) return;
    const isCell = (t: EventTarget | null): t is Element => t instanceof Element && t.getAttribute('role') === 'gridcell' && el.contains(t);
    const onKey = (e: KeyboardEvent) => {
      const target = e.target;
      if (!isCell(target) || e.altKey || e.metaKey) return;
      const activate = e.key === 'Enter' || e.key === ' ';
      const move = /^(Arrow(Left|Right|Up|Down)|Home|End|Page(Up|Down))$/.test(e.key);
      if (!activate && !move) return;
      e.preventDefault();
      const { key, ctrlKey } = e;
      if (activate) { latest.current.onActivate(target); return; }
      void gridNow().then((g) => {
        if (!g || !g.owns(target)) return;
        const next = g.move(key as Parameters<ChartGrid['move']>[0], ctrlKey);
        if (!next) return;
        g.focus(next);
        spot.current = g.spot();
        latest.current.onFocusCell?.(next.getAttribute('aria-label'));
      });
    };
    const onFocusIn = (e: FocusEvent) => {
      const target = e.target;
      if (!isCell(target)) return;
      focused.current = true;
      void gridNow().then((g) => {
        if (!g || !g.owns(target) || !focused.current) return;
        g.prepare();
        g.setActive(target);
        // Preparing the back view gathers its cells into row groups; moving the focused cell drops its focus.
        if (document.activeElement !== target) g.focus(target); else g.showRing(target);
        latest.current.onFocusCell?.(target.getAttribute('aria-label'));
      });
    };
    const onFocusOut = (e: FocusEvent) => {
      if (isCell(e.relatedTarget)) return;
      focused.current = false;
      drawn.current?.grid?.hideRing();
      if (isCell(e.target)) latest.current.onFocusCell?.(null);
    };
    el.addEventListener('keydown', onKey);
    el.addEventListener('focusin', onFocusIn);
    el.addEventListener('focusout', onFocusOut);
    return () => {
      el.removeEventListener('keydown', onKey);
      el.removeEventListener('focusin', onFocusIn);
      el.removeEventListener('focusout', onFocusOut);
    };
  }, [holder, gridNow]);

  const select = useCallback((cell: Element) => {
    void gridNow().then((g) => {
      if (!g || !g.owns(cell)) return;
      g.setActive(cell);
      spot.current = g.spot();
    });
  }, [gridNow]);
  return { select };
}
