/**
 * The line diff of two sources side by side: the old revision's lines on
 * the left, the new one's on the right, removed lines red, added green,
 * runs of removed and added lines paired row by row. The new side's line
 * numbers are buttons: they start a comment on that line of the new
 * revision. Lines with a thread show a marker.
 */
import type { TextDiff, TextHunk, TextLine } from '../../../shared/diff/types';

interface Row { left: TextLine | null; right: TextLine | null }

/** Pairs a hunk's lines into side-by-side rows (context on both sides; removed beside added). */
export function pairRows(h: TextHunk): Row[] {
  const rows: Row[] = [];
  let i = 0;
  while (i < h.lines.length) {
    const line = h.lines[i];
    if (line.kind === 'context') { rows.push({ left: line, right: line }); i++; continue; }
    const removed: TextLine[] = [], added: TextLine[] = [];
    while (i < h.lines.length && h.lines[i].kind === 'removed') removed.push(h.lines[i++]);
    while (i < h.lines.length && h.lines[i].kind === 'added') added.push(h.lines[i++]);
    for (let k = 0; k < Math.max(removed.length, added.length); k++) rows.push({ left: removed[k] ?? null, right: added[k] ?? null });
  }
  return rows;
}

export interface TextDiffViewProps {
  text: TextDiff;
  from: number;
  to: number;
  /** New-revision lines that carry a comment thread. */
  commented: Set<number>;
  onCommentLine: (line: number) => void;
  /** Show one revision's lines only (no old side). */
  single?: boolean;
}

function Cell({ line, side, commented, onComment, to }: { line: TextLine | null; side: 'old' | 'new'; commented: boolean; onComment?: (n: number) => void; to: number }) {
  if (!line) return <><td className="w-10 bg-tide-50" /><td className="bg-tide-50" /></>;
  const n = side === 'old' ? line.old : line.new;
  const tone = line.kind === 'removed' ? 'bg-glasswort-50' : line.kind === 'added' ? 'bg-samphire-50' : '';
  const sign = line.kind === 'removed' ? '−' : line.kind === 'added' ? '+' : ' ';
  return (
    <>
      <td className={`w-10 select-none border-r border-tide-100 pr-1 text-right align-top text-tide-500 ${tone}`}>
        {side === 'new' && n !== null && onComment ? (
          <button type="button" onClick={() => onComment(n)} aria-label={`Comment on line ${n} of revision ${to}`}
            className={`w-full rounded-sm text-right hover:bg-lavender-100 hover:text-lavender-800 ${commented ? 'font-semibold text-lavender-700' : ''}`}>
            {commented && <span aria-hidden="true">● </span>}{n}
          </button>
        ) : n}
      </td>
      <td className={`whitespace-pre-wrap break-words px-2 align-top ${tone}`}>
        <span aria-hidden="true" className="mr-1 select-none text-tide-500">{sign}</span>
        <span className="sr-only">{line.kind === 'removed' ? 'removed: ' : line.kind === 'added' ? 'added: ' : ''}</span>
        {line.text}
      </td>
    </>
  );
}

export function TextDiffView({ text, from, to, commented, onCommentLine, single = false }: TextDiffViewProps) {
  if (text.hunks.length === 0) return <p className="p-4 text-sm text-tide-600">The source text is the same in both revisions.</p>;
  return (
    <div className="overflow-x-auto" data-testid="text-diff">
      {text.replacedWhole && <p className="px-3 py-2 text-caption text-mudflat-800">The sources differ too much to line up; the whole text is shown as replaced.</p>}
      <table className="w-full table-fixed border-collapse font-mono text-[0.78rem] leading-5">
        <colgroup>{!single && <><col className="w-10" /><col /></>}<col className="w-10" /><col /></colgroup>
        <thead className="sr-only"><tr>{!single && <><th>Line in #{from}</th><th>Revision #{from}</th></>}<th>Line in #{to}</th><th>Revision #{to}</th></tr></thead>
        {text.hunks.map((h) => (
          <tbody key={`${h.oldStart}-${h.newStart}`}>
            {!single && <tr><td colSpan={4} className="border-y border-tide-200 bg-lavender-50 px-2 py-0.5 font-sans text-caption text-lavender-900">
              Lines {h.oldStart}–{h.oldStart + Math.max(0, h.oldLines - 1)} of #{from} · lines {h.newStart}–{h.newStart + Math.max(0, h.newLines - 1)} of #{to}
            </td></tr>}
            {pairRows(h).map((r, i) => (
              <tr key={i}>
                {!single && <Cell line={r.left} side="old" commented={false} to={to} />}
                <Cell line={r.right} side="new" commented={r.right?.new != null && commented.has(r.right.new)} onComment={onCommentLine} to={to} />
              </tr>
            ))}
          </tbody>
        ))}
      </table>
    </div>
  );
}
