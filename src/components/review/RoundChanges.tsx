/**
 * The changed rounds of one size: added, removed and changed rounds in
 * working order with the old and new stitch counts (front, backing, total),
 * what changed, how many chart cells changed, plus a changed cast-on, moved
 * backing columns and renumbered runs. Each round has a button to comment
 * on it; rounds with a thread are marked.
 */
import type { RoundChange, RoundState, SizeDiff } from '../../../shared/diff/types';

const aspectWords: Record<string, string> = {
  counts: 'counts', stitches: 'stitches', backing: 'backing', floats: 'floats', markers: 'markers', side: 'side', note: 'note',
};

function Counts({ r }: { r: RoundState | null }) {
  if (!r) return <span className="text-tide-400">—</span>;
  return <span className="tabular">{r.front} · {r.backing} · <strong>{r.total}</strong></span>;
}

function countsDiffer(c: RoundChange): boolean {
  return !!c.old && !!c.new && (c.old.front !== c.new.front || c.old.backing !== c.new.backing || c.old.total !== c.new.total);
}

export interface RoundChangesProps {
  size: SizeDiff;
  /** New-revision round numbers that carry a thread. */
  commented: Set<number>;
  selected: number | null;
  onComment: (round: number) => void;
}

export function RoundChanges({ size, commented, selected, onComment }: RoundChangesProps) {
  const Word = size.word === 'row' ? 'Row' : 'Round';
  return (
    <div data-testid="round-changes">
      {size.castOn && <p className="px-4 pt-3 text-sm">Cast-on changed: <span className="tabular">{size.castOn.old} → {size.castOn.new}</span> stitches.</p>}
      {size.rounds.length === 0 ? (
        <p className="px-4 py-3 text-sm text-tide-600">No {size.word}s changed in size {size.size}.</p>
      ) : (
        <table className="mt-1 w-full text-sm">
          <caption className="px-4 py-2 text-left text-caption text-tide-600">
            Counts are front · backing · <strong>total</strong> stitches after the {size.word}.
          </caption>
          <thead>
            <tr className="text-left text-caption uppercase tracking-wide text-tide-600">
              <th scope="col" className="px-4 py-1 font-semibold">{Word}</th>
              <th scope="col" className="px-2 py-1 font-semibold">Change</th>
              <th scope="col" className="px-2 py-1 font-semibold">Old counts</th>
              <th scope="col" className="px-2 py-1 font-semibold">New counts</th>
              <th scope="col" className="px-4 py-1"><span className="sr-only">Comment</span></th>
            </tr>
          </thead>
          <tbody>
            {size.rounds.map((c, i) => {
              const n = c.new?.number ?? null;
              const label = c.kind === 'added' ? `${Word} ${n} added` : c.kind === 'removed' ? `${Word} ${c.old?.number} removed`
                : c.old?.number === n ? `${Word} ${n}` : `${Word} ${c.old?.number} → ${n}`;
              const counts = countsDiffer(c);
              return (
                <tr key={i} className={`border-t border-tide-100 align-top ${n !== null && n === selected ? 'bg-lavender-50' : ''}`} data-round={n ?? undefined}>
                  <th scope="row" className="px-4 py-2 text-left font-medium">
                    {n !== null && commented.has(n) && <span className="mr-1 text-lavender-700" title="Has comments" aria-label="Has comments">●</span>}
                    {label}
                  </th>
                  <td className="px-2 py-2 text-tide-800">
                    {c.kind === 'changed' ? c.aspects.map((a) => aspectWords[a]).join(', ') : c.kind}
                    {c.cellsChanged > 0 && <span className="block text-caption text-tide-600">{c.cellsChanged} chart cell{c.cellsChanged === 1 ? '' : 's'}</span>}
                  </td>
                  <td className={`px-2 py-2 ${counts ? 'text-glasswort-700' : ''}`}><Counts r={c.old} /></td>
                  <td className={`px-2 py-2 ${counts ? 'text-samphire-800' : ''}`}><Counts r={c.new} /></td>
                  <td className="px-4 py-2 text-right">
                    {n !== null && (
                      <button type="button" className="btn btn-quiet btn-sm" onClick={() => onComment(n)} aria-label={`Comment on ${size.word} ${n}`}>Comment</button>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      )}
      {size.columns.length > 0 && (
        <div className="px-4 py-2 text-sm">
          <h4 className="text-caption font-semibold uppercase tracking-wide text-tide-600">Backing columns</h4>
          <ul className="mt-1 space-y-0.5">
            {size.columns.map((col, i) => {
              const s = col.new ?? col.old;
              const where = (c: typeof s) => c ? `after ${c.after} sts, ${size.word}s ${c.firstRound}–${c.lastRound}` : '';
              return <li key={i}>{s?.yarn}: {col.kind}{col.kind === 'moved' || col.kind === 'changed' ? ` from ${where(col.old)} to ${where(col.new)}` : ` (${where(s)})`}</li>;
            })}
          </ul>
        </div>
      )}
      {size.renumbered.length > 0 && (
        <p className="px-4 py-2 text-caption text-tide-600">
          Unchanged but renumbered: {size.renumbered.map((r) => `${r.old.first}–${r.old.last} → ${r.new.first}–${r.new.last}`).join('; ')}.
        </p>
      )}
    </div>
  );
}
