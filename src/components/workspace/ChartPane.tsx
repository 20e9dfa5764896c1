/**
 * Chart pane: the chart of one size as the compiler draws it (SVG from
 * shared/render, drawn in the compile worker), the front of the work or the
 * back (backing columns and floats), with a size switcher and zoom.
 * Clicking a stitch moves the editor to the text that made it; the
 * stitches made by the line under the editor's cursor are outlined.
 * The chart is also a keyboard grid (components/chart/useChartGrid.ts): one
 * tab stop, arrow keys between stitches, Enter or Space does what a click does.
 *
 * Reads the renderer's data attributes: stitch cells carry data-from/data-to
 * (source span) and data-stitch, row groups (and back-view cells) carry
 * data-round, floats carry data-yarn and data-stitches.
 */
import { memo, useEffect, useRef, useState, type MouseEvent } from 'react';
import type { ChartMessage } from '../../editor/protocol';
import { useChartGrid } from '../chart/useChartGrid';

/** Cell sizes offered by zoom, in px. */
export const ZOOM_STEPS = [6, 8, 10, 12, 16, 20, 24, 32] as const;

export interface ChartSettings {
  size: string | null;
  side: 'front' | 'back';
  cell: number;
}

export interface ChartPaneProps {
  chart: ChartMessage | null;
  sizes: string[];
  /** Yarns of the pattern, to name a stitch's yarn from its colour. */
  yarns: { name: string; label: string; colour: string }[];
  settings: ChartSettings;
  onSettings: (s: ChartSettings) => void;
  /** True while the drawing is older than the editor's text. */
  stale: boolean;
  /** Offsets of the line under the cursor in the compiled text (null when the text has moved on). */
  cursorSpan: { from: number; to: number } | null;
  onJump: (from: number, to: number) => void;
  word: 'Round' | 'Row';
}

export const ChartPane = memo(function ChartPane({ chart, sizes, yarns, settings, onSettings, stale, cursorSpan, onJump, word }: ChartPaneProps) {
  const box = useRef<HTMLDivElement>(null);
  const [hover, setHover] = useState<string | null>(null);
  const outlined = useRef<Element[]>([]);
  const size = chart?.size ?? settings.size ?? sizes[0] ?? '';
  const zoomIndex = Math.max(0, ZOOM_STEPS.indexOf(settings.cell as (typeof ZOOM_STEPS)[number]));

  // A newly chosen size or side opens where knitting starts: round 1 sits at
  // the bottom and rounds are read from the right.
  const shownKey = chart?.svg ? `${chart.size}/${chart.side}` : null;
  useEffect(() => {
    const el = box.current;
    if (el && shownKey) { el.scrollTop = el.scrollHeight; el.scrollLeft = el.scrollWidth; }
  }, [shownKey]);

  // Outline the stitches made by the cursor's line, and bring the first into view.
  useEffect(() => {
    for (const el of outlined.current) el.classList.remove('lw-here');
    outlined.current = [];
    const root = box.current;
    if (!root || !cursorSpan) return;
    for (const el of root.querySelectorAll('[data-from]')) {
      const from = Number(el.getAttribute('data-from'));
      if (from >= cursorSpan.from && from <= cursorSpan.to) outlined.current.push(el);
    }
    for (const el of outlined.current) el.classList.add('lw-here');
    outlined.current[0]?.scrollIntoView({ block: 'nearest', inline: 'nearest' });
  }, [cursorSpan, chart]);

  const yarnByColour = new Map(yarns.map((y) => [y.colour.toLowerCase(), y]));
  const cellOf = (e: MouseEvent) => (e.target as Element).closest?.('[data-from], [data-stitch]') ?? null;
  const jumpFrom = (cell: Element) => {
    const from = Number(cell.getAttribute('data-from') ?? NaN);
    const to = Number(cell.getAttribute('data-to') ?? NaN);
    if (Number.isFinite(from)) onJump(from, Number.isFinite(to) ? to : from);
  };
  const sideWords = chart?.side === 'back' ? 'back of the work' : 'front';
  const { select } = useChartGrid(box, {
    drawing: chart?.svg ?? null,
    word,
    yarns,
    label: `Chart of size ${chart?.size ?? size}, ${sideWords}`,
    hint: 'Enter: go to its line.',
    onActivate: jumpFrom,
    onFocusCell: setHover,
  });
  const onClick = (e: MouseEvent) => {
    const cell = cellOf(e);
    if (!cell) return;
    select(cell);
    jumpFrom(cell);
  };
  const onMove = (e: MouseEvent) => {
    const target = e.target as Element;
    const float = target.closest?.('g.float[data-stitches]');
    if (float) {
      const over = float.classList.contains('over-limit');
      setHover(`${word} ${float.getAttribute('data-round')}: ${float.getAttribute('data-yarn')} floats behind ${float.getAttribute('data-stitches')} stitches${over ? ', longer than the float limit' : ''}`);
      return;
    }
    const cell = cellOf(e);
    const round = cell?.closest('[data-round]')?.getAttribute('data-round');
    if (!cell || !round) { setHover(null); return; }
    const fill = (cell.getAttribute('fill') ?? cell.firstElementChild?.getAttribute('fill') ?? '').toLowerCase();
    const yarn = yarnByColour.get(fill);
    const stitch = cell.getAttribute('data-stitch');
    setHover(`${word} ${round}${stitch ? `, stitch ${stitch}` : ''}${yarn ? ` in ${yarn.name} (${yarn.label})` : ''}${cell.classList.contains('backing') ? ', backing stitch' : ''}`);
  };

  return (
    <div className="flex h-full min-h-0 flex-col">
      <div className="flex flex-wrap items-center gap-3 border-b border-tide-200 px-4 py-2 text-caption text-tide-700">
        <div role="group" aria-label="Size" className="flex overflow-hidden rounded-stitch border border-tide-300">
          {sizes.map((s) => (
            <button key={s} type="button" aria-pressed={s === size} onClick={() => onSettings({ ...settings, size: s })}
              className={`px-2.5 py-1 font-medium ${s === size ? 'bg-lavender-700 text-white' : 'bg-white text-tide-800 hover:bg-tide-50'}`}>
              {s}
            </button>
          ))}
        </div>
        <div role="group" aria-label="Side of the work" className="flex overflow-hidden rounded-stitch border border-tide-300">
          {(['front', 'back'] as const).map((side) => (
            <button key={side} type="button" aria-pressed={settings.side === side} onClick={() => onSettings({ ...settings, side })}
              className={`px-2.5 py-1 font-medium ${settings.side === side ? 'bg-lavender-700 text-white' : 'bg-white text-tide-800 hover:bg-tide-50'}`}>
              {side === 'front' ? 'Front' : 'Back of work'}
            </button>
          ))}
        </div>
        <div className="flex items-center gap-1" role="group" aria-label="Zoom">
          <button type="button" className="btn btn-quiet btn-sm" aria-label="Zoom out" disabled={zoomIndex === 0}
            onClick={() => onSettings({ ...settings, cell: ZOOM_STEPS[Math.max(0, zoomIndex - 1)] })}>−</button>
          <span className="w-14 text-center tabular" aria-live="polite">{Math.round((settings.cell / 16) * 100)}%</span>
          <button type="button" className="btn btn-quiet btn-sm" aria-label="Zoom in" disabled={zoomIndex === ZOOM_STEPS.length - 1}
            onClick={() => onSettings({ ...settings, cell: ZOOM_STEPS[Math.min(ZOOM_STEPS.length - 1, zoomIndex + 1)] })}>+</button>
        </div>
        {stale && <span className="ml-auto text-tide-600" role="status">Redrawing…</span>}
      </div>
      <div ref={box} className="lw-chart relative min-h-0 flex-1 overflow-auto bg-tide-50 p-3" onClick={onClick} onMouseMove={onMove} onMouseLeave={() => setHover(null)}
        data-testid="chart">
        {!chart ? (
          <p className="p-4 text-sm text-tide-600" role="status">Drawing the chart…</p>
        ) : chart.svg ? (
          <div className="inline-block rounded-stitch border border-tide-200 bg-white shadow-sm" dangerouslySetInnerHTML={{ __html: chart.svg }} />
        ) : (
          <p className="p-4 text-sm text-tide-700">{chart.problem}</p>
        )}
      </div>
      <div className="flex h-7 shrink-0 items-center border-t border-tide-200 px-4 text-caption text-tide-700" aria-live="off">
        {hover ?? 'Point at a stitch to see what it is; click (or Enter) to go to its line.'}
      </div>
    </div>
  );
});
