/**
 * Counts pane: every round in every size — stitches on the needle after the
 * round (total, split into front and backing when backing stitches are
 * carried) and the longest float. Rounds with problems are tinted; the
 * round under the editor's cursor is highlighted; a click on a round moves
 * the editor to the line that made it.
 */
import { memo, useEffect, useMemo, useRef, useState } from 'react';
import type { RoundSummary, Severity, Span } from '../../../shared';
import type { CompiledView } from '../../editor/protocol';
import { floatLength, floatLimitStitches, problemRounds, roundKey } from '../../editor/rounds';

interface Row {
  number: number;
  bySize: (RoundSummary | null)[];
  span: Span;
}

/** Rows by round number across sizes (sizes may have different round counts). */
function buildRows(view: CompiledView): Row[] {
  const rows = new Map<number, Row>();
  view.sizes.forEach((s, i) => {
    for (const r of s.rounds) {
      let row = rows.get(r.number);
      if (!row) {
        row = { number: r.number, bySize: view.sizes.map(() => null), span: r.span };
        rows.set(r.number, row);
      }
      row.bySize[i] = r;
    }
  });
  return [...rows.values()].sort((a, b) => a.number - b.number);
}

const tint = { error: 'bg-glasswort-50', warning: 'bg-mudflat-50', info: '' } as const;

export interface CountsPaneProps {
  view: CompiledView | null;
  cursorLine: number;
  onJump: (span: Span) => void;
}

export const CountsPane = memo(function CountsPane({ view, cursorLine, onJump }: CountsPaneProps) {
  const [onlyProblems, setOnlyProblems] = useState(false);
  const rows = useMemo(() => (view ? buildRows(view) : []), [view]);
  const problems = useMemo(() => (view ? problemRounds(view) : new Map<string, Severity>()), [view]);
  const limit = view ? floatLimitStitches(view.header) : null;
  const currentRef = useRef<HTMLTableRowElement>(null);

  const isCurrent = (row: Row) => row.bySize.some((r) => r && r.span.line <= cursorLine && cursorLine <= r.span.endLine);
  const firstCurrent = rows.findIndex(isCurrent);
  useEffect(() => {
    currentRef.current?.scrollIntoView({ block: 'nearest' });
  }, [firstCurrent]);

  if (!view) return <p className="p-5 text-sm text-tide-600" role="status">Counting stitches…</p>;
  if (view.sizes.length === 0 || rows.length === 0) {
    return (
      <div className="p-6 text-sm text-tide-700">
        <h3 className="font-semibold text-tide-900">No {view.header.construction === 'flat' ? 'rows' : 'rounds'} yet</h3>
        <p className="mt-1">
          Cast on and write the first round; the stitch count after every round appears here for every size.
          {view.diagnostics.some((d) => d.severity === 'error') && ' (Fix the problems first if the pattern does not parse.)'}
        </p>
      </div>
    );
  }

  const sizeNames = view.sizes.map((s) => s.name);
  const word = view.header.construction === 'flat' ? 'Row' : 'Round';
  const shown = onlyProblems ? rows.filter((row) => sizeNames.some((s) => problems.has(roundKey(s, row.number)))) : rows;
  const anyBacking = view.sizes.some((s) => s.rounds.some((r) => r.backing > 0));

  return (
    <div className="flex h-full min-h-0 flex-col">
      <div className="flex flex-wrap items-center gap-x-5 gap-y-1 border-b border-tide-200 px-4 py-2 text-caption text-tide-700">
        <span>
          Cast on:{' '}
          {view.sizes.map((s, i) => (
            <span key={s.name} className="tabular">{i > 0 && ' · '}<strong className="font-semibold text-tide-900">{s.name}</strong> {s.castOn}</span>
          ))}
        </span>
        {anyBacking && <span>Counts read total (front + backing)</span>}
        <span>
          Float limit {view.header.floatLimit.value} {view.header.floatLimit.unit}
          {limit !== null ? ` ≈ ${limit.toFixed(1)} sts` : ' (no gauge declared)'}
        </span>
        <label className="ml-auto flex items-center gap-1.5">
          <input type="checkbox" checked={onlyProblems} onChange={(e) => setOnlyProblems(e.target.checked)} className="accent-lavender-700" />
          Only {word.toLowerCase()}s with problems
        </label>
      </div>
      <div className="min-h-0 flex-1 overflow-auto" tabIndex={-1}>
        <table className="w-full border-separate border-spacing-0 text-tally tabular" aria-label={`Stitch counts per ${word.toLowerCase()} and size`}>
          <thead>
            <tr>
              <th scope="col" className="sticky top-0 z-10 border-b border-tide-200 bg-tide-50 px-3 py-1.5 text-left text-caption font-semibold text-tide-700">{word}</th>
              {sizeNames.map((s) => (
                <th key={s} scope="col" className="sticky top-0 z-10 border-b border-l border-tide-200 bg-tide-50 px-3 py-1.5 text-left text-caption font-semibold text-tide-700">
                  Size {s}
                  <span className="block font-normal text-tide-600">sts · longest float</span>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {shown.map((row, index) => {
              const current = isCurrent(row);
              const side = row.bySize.find(Boolean)?.side;
              return (
                <tr key={row.number} ref={current && rows.indexOf(row) === firstCurrent ? currentRef : undefined}
                  className={current ? 'bg-lavender-50' : index % 2 ? 'bg-tide-50/40' : ''}>
                  <th scope="row" className={`border-b border-tide-100 px-1 py-0.5 text-left font-normal ${current ? 'shadow-[inset_3px_0_0] shadow-lavender-600' : ''}`}>
                    <button type="button" className="w-full rounded-stitch px-2 py-0.5 text-left font-medium text-lavender-800 hover:bg-lavender-100"
                      onClick={() => onJump(row.span)} aria-label={`${word} ${row.number}: go to its line`}>
                      {row.number}
                      {side === 'WS' && <span className="ml-1 text-caption font-normal text-tide-600">WS</span>}
                    </button>
                  </th>
                  {row.bySize.map((r, i) => {
                    const severity = problems.get(roundKey(sizeNames[i], row.number));
                    if (!r) return <td key={sizeNames[i]} className="border-b border-l border-tide-100 px-3 text-tide-500">—</td>;
                    const f = r.longestFloat;
                    const long = f && limit !== null && f.stitches > limit;
                    return (
                      <td key={sizeNames[i]} className={`border-b border-l border-tide-100 px-3 py-1 ${severity ? tint[severity] : ''}`}
                        title={severity ? `${word} ${row.number}, size ${sizeNames[i]} has ${severity === 'error' ? 'an error' : 'a warning'}; see Problems` : undefined}>
                        <span className="font-semibold text-tide-900">{r.total}</span>
                        {r.backing > 0 && <span className="text-tide-600"> ({r.front} + {r.backing})</span>}
                        <span className={`ml-2 ${long ? 'font-semibold text-glasswort-700' : 'text-tide-600'}`}>
                          {f ? `${long ? '⚠ ' : ''}${f.stitches} ${f.yarn}` : ''}
                          {f && long && floatLength(view.header, f.stitches) ? ` (${floatLength(view.header, f.stitches)})` : ''}
                        </span>
                        {severity === 'error' && <span className="sr-only"> (has an error)</span>}
                      </td>
                    );
                  })}
                </tr>
              );
            })}
          </tbody>
        </table>
        {shown.length === 0 && <p className="p-5 text-sm text-samphire-700">No round has a problem in any size.</p>}
      </div>
    </div>
  );
});
