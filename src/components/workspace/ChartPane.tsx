/**
 * Chart pane: the chart of one size as the compiler draws it (SVG from
 * shared/render, drawn in the compile worker), the front of the work or the
 * back (backing columns and floats), with a size switcher and zoom.
 * Clicking a stitch moves the editor to the text that made it; the
 * stitches made by the line under the editor's cursor are outlined.
 */
import { memo, useEffect, useRef, useState, type MouseEvent } from 'react';
import type { ChartMessage } from '../../editor/protocol';

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
  settings: ChartSettings;
  onSettings: (s: ChartSettings) => void;
  /** True while the drawing is older than the editor's text. */
  stale: boolean;
  cursorLine: number;
  onJump: (from: number, to: number) => void;
  word: 'Round' | 'Row';
}

interface HoverInfo { round: string; stitch: string; op: string | null; yarn: string | null }

export const ChartPane = memo(function ChartPane({ chart, sizes, settings, onSettings, stale, cursorLine, onJump, word }: ChartPaneProps) {
  const box = useRef<HTMLDivElement>(null);
  const [hover, setHover] = useState<HoverInfo | null>(null);
  const size = chart?.size ?? settings.size ?? sizes[0] ?? '';
  const zoomIndex = Math.max(0, ZOOM_STEPS.indexOf(settings.cell as (typeof ZOOM_STEPS)[number]));

  // A newly chosen size or side opens where knitting starts: round 1 sits at
  // the bottom and rounds are read from the right.
  const shownKey = chart?.svg ? `${chart.size}/${chart.side}` : null;
  useEffect(() => {
    const el = box.current;
    if (el && shownKey) { el.scrollTop = el.scrollHeight; el.scrollLeft = el.scrollWidth; }
  }, [shownKey]);

  useEffect(() => {
    const first = box.current?.querySelector(`g[data-line="${cursorLine}"]`);
    first?.scrollIntoView({ block: 'nearest', inline: 'nearest' });
  }, [cursorLine, chart]);

  const cellOf = (e: MouseEvent) => (e.target as Element).closest?.('g[data-round]') ?? null;
  const onClick = (e: MouseEvent) => {
    const g = cellOf(e);
    const from = Number(g?.getAttribute('data-from'));
    const to = Number(g?.getAttribute('data-to'));
    if (g && g.getAttribute('data-from') !== null && Number.isFinite(from)) onJump(from, Number.isFinite(to) ? to : from);
  };
  const onMove = (e: MouseEvent) => {
    const g = cellOf(e);
    if (!g) { setHover(null); return; }
    setHover({
      round: g.getAttribute('data-round') ?? '',
      stitch: g.getAttribute('data-stitch') ?? '',
      op: g.getAttribute('data-op'),
      yarn: g.getAttribute('data-yarn'),
    });
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
        <style>{`.lw-chart g[data-line="${cursorLine}"] > rect:first-child { stroke: #2d2441; stroke-width: 2px; }
.lw-chart g[data-from] { cursor: pointer; }`}</style>
        {!chart ? (
          <p className="p-4 text-sm text-tide-600" role="status">Drawing the chart…</p>
        ) : chart.svg ? (
          <div role="img" aria-label={`Chart of size ${chart.size}, ${chart.side === 'back' ? 'back of the work' : 'front'}. Click a stitch to go to its line.`}
            className="inline-block rounded-stitch border border-tide-200 bg-white shadow-sm" dangerouslySetInnerHTML={{ __html: chart.svg }} />
        ) : (
          <p className="p-4 text-sm text-tide-700">{chart.problem}</p>
        )}
      </div>
      <div className="flex h-7 shrink-0 items-center border-t border-tide-200 px-4 text-caption text-tide-700" aria-live="off">
        {hover
          ? `${word} ${hover.round}, stitch ${hover.stitch}${hover.op ? `: ${hover.op}` : ''}${hover.yarn ? ` in ${hover.yarn}` : ''}`
          : `Point at a stitch to see what it is; click to go to its line.`}
      </div>
    </div>
  );
});
