/**
 * The new revision's chart of one size (drawn by shared/render in the
 * render worker) with the diff's changed cells outlined and changed rounds
 * flagged at both ends of the row. Clicking a row starts a comment on that
 * round; the chart is also a keyboard grid (components/chart/useChartGrid.ts)
 * where Enter or Space on a cell does the same.
 */
import { useEffect, useRef, useState, type KeyboardEvent, type MouseEvent } from 'react';
import type { SizeDiff } from '../../../shared/diff/types';
import { useChartGrid } from '../chart/useChartGrid';
import { centreWithin, markCells } from './mark-cells';
import { useRendered } from './useRendered';

export interface DiffChartProps {
  source: string | null;
  size: SizeDiff;
  revision: number;
  onCommentRound: (round: number) => void;
  /** One revision by itself: nothing is marked. */
  single?: boolean;
}

export function DiffChart({ source, size, revision, onCommentRound, single = false }: DiffChartProps) {
  const { answer, pending } = useRendered(source, size.size, { cell: 14 });
  const box = useRef<HTMLDivElement>(null);
  const [missed, setMissed] = useState(0);
  const svg = answer && answer.size === size.size ? answer.svg : null;
  const Word = size.word === 'row' ? 'Row' : 'Round';

  useEffect(() => {
    const el = box.current?.querySelector('svg');
    if (!el || !svg) return;
    const cells = size.cells.filter((c) => c.new).map((c) => ({ round: c.round.new, stitch: c.new?.stitch ?? 0 }));
    const rows = size.rounds.filter((r) => r.new && r.kind !== 'removed').map((r) => r.new?.number ?? 0);
    const { missed: m, undo } = markCells(el, cells, rows);
    setMissed(m);
    const scroller = box.current;
    const first = el.querySelector('.lw-diff-cell, .lw-diff-row');
    if (scroller && first) centreWithin(scroller, first);
    return undo;
  }, [svg, size]);

  const roundAt = (e: MouseEvent | KeyboardEvent) => Number((e.target as Element).closest?.('[data-round]')?.getAttribute('data-round') ?? NaN);
  const { select } = useChartGrid(box, {
    drawing: svg,
    word: Word,
    label: `Chart of revision ${revision}, size ${size.size}`,
    hint: `Enter: comment on this ${size.word}.`,
    onActivate: (cell) => { const r = Number(cell.closest('[data-round]')?.getAttribute('data-round') ?? NaN); if (Number.isFinite(r)) onCommentRound(r); },
  });
  const onClick = (e: MouseEvent) => {
    const r = roundAt(e);
    if (!Number.isFinite(r)) return;
    const cell = (e.target as Element).closest('g.row > *');
    if (cell) select(cell);
    onCommentRound(r);
  };

  return (
    <div>
      <p className="px-4 py-2 text-caption text-tide-700">
        Revision #{revision}, size {size.size}{single ? '.' : `: changed cells outlined in red, changed ${size.word}s flagged at both ends.`} Click a {size.word} to comment on it.
        {size.cellsTotal > size.cells.length && ` Showing ${size.cells.length} of ${size.cellsTotal} changed cells.`}
        {missed > 0 && ` ${missed} changed cell${missed === 1 ? '' : 's'} could not be placed on the chart.`}
      </p>
      <div ref={box} className="lw-chart lw-diff-chart relative max-h-[28rem] overflow-auto bg-tide-50 p-3" onClick={onClick} data-testid="diff-chart">
        {!answer || (pending && !svg) ? <p role="status" className="p-4 text-sm text-tide-600">Drawing the chart…</p>
          : svg ? (
            <div aria-label={`Chart of revision ${revision}, size ${size.size}, with ${size.cellsTotal} changed cells marked. ${Word}s can be clicked to comment; the table of changed ${size.word}s has the same buttons.`}
              role="group" className="inline-block rounded-stitch border border-tide-200 bg-white" dangerouslySetInnerHTML={{ __html: svg }} />
          ) : <p className="p-4 text-sm text-tide-700">{answer.problem ?? 'No chart for this size.'}</p>}
      </div>
    </div>
  );
}
