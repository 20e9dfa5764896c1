/**
 * One comparison of two revisions, side by side: the source line diff on
 * the left; on the right the changed rounds of the chosen size with old and
 * new counts, the comment threads of the newer revision, the chart with its
 * changed cells marked, and header changes with problems introduced and
 * fixed. A round (in the table or the chart) or a line number starts a
 * comment anchored there. `from` equal to `to` shows that revision alone.
 */
import { useMemo, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router';
import type { ApiPattern } from '../../shared/api-schemas';
import type { TextDiff } from '../../shared/diff/types';
import { errorText } from '../api/client';
import { usePattern } from '../api/usePatterns';
import { useComments, useDiff, useRevisionSource, type NewComment } from '../api/useReview';
import { Loading } from '../components/Loading';
import { Notice } from '../components/Notice';
import { CommentThreads } from '../components/review/CommentThreads';
import { DiffChart } from '../components/review/DiffChart';
import { DiffFacts } from '../components/review/DiffFacts';
import { PageHeader } from '../components/review/PageHeader';
import { RoundChanges } from '../components/review/RoundChanges';
import { TextDiffView } from '../components/review/TextDiffView';

const positive = (s: string | null) => { const n = Number(s); return Number.isInteger(n) && n > 0 ? n : 0; };

/** The whole source as one hunk of context lines (to comment on a revision by itself). */
function wholeSource(source: string): TextDiff {
  const lines = source.split('\n');
  if (lines.at(-1) === '') lines.pop();
  return {
    hunks: [{ oldStart: 1, oldLines: lines.length, newStart: 1, newLines: lines.length, lines: lines.map((text, i) => ({ kind: 'context', old: i + 1, new: i + 1, text })) }],
    added: 0, removed: 0, replacedWhole: false,
  };
}

export function Component() {
  const { id = '' } = useParams();
  const [params] = useSearchParams();
  const from = positive(params.get('from'));
  const to = positive(params.get('to'));
  const pattern = usePattern(id);
  const diff = useDiff(id, from, to);
  const newer = useRevisionSource(id, to || null);
  const comments = useComments(id, to);
  const [sizeName, setSizeName] = useState<string | null>(null);
  const [anchor, setAnchor] = useState<Omit<NewComment, 'body'> | null>(null);

  const sizes = diff.data?.semantic.sizes ?? [];
  const size = sizes.find((s) => s.size === sizeName) ?? sizes[0] ?? null;
  const word = size?.word === 'row' ? 'Row' : 'Round';
  const commentedRounds = useMemo(() => new Set((comments.data ?? []).flatMap((c) => (c.round !== null ? [c.round] : []))), [comments.data]);
  const commentedLines = useMemo(() => new Set((comments.data ?? []).flatMap((c) => (c.fromLine !== null ? [c.fromLine] : []))), [comments.data]);

  if (!from || !to) return <div className="mx-auto max-w-lg p-6"><Notice tone="error">Choose two revisions to compare (from and to).</Notice></div>;
  if (pattern.isPending || diff.isPending) return <Loading label={`Comparing revisions #${from} and #${to}…`} />;
  const failed = pattern.error ?? diff.error;
  if (failed || !pattern.data || !diff.data) {
    return (
      <div className="mx-auto mt-16 max-w-lg px-6">
        <h1 className="text-title">The changes could not be shown</h1>
        <Notice tone="error" className="mt-3">{errorText(failed)}</Notice>
        <Link to={`/patterns/${id}/review`} className="btn btn-quiet mt-4">Back to the review</Link>
      </div>
    );
  }
  const p = pattern.data.pattern as unknown as ApiPattern;
  const d = diff.data.semantic;
  const s = d.summary;
  const single = from === to;
  const text = single ? (newer.data?.source !== undefined ? wholeSource(newer.data.source) : null) : d.text;

  return (
    <div className="min-h-0 flex-1 overflow-auto">
      <PageHeader patternId={id} title={p.title} status={p.status} role={p.myRole}
        subtitle={single ? `Revision #${to}` : `Changes from revision #${from} to #${to}`}>
        <Link to={`/patterns/${id}/review`} className="btn btn-quiet btn-sm">All revisions</Link>
      </PageHeader>
      <div className="flex flex-wrap items-center gap-x-5 gap-y-1 border-b border-tide-200 bg-white px-4 py-2 text-sm" role="status" data-testid="diff-summary">
        {single ? <span>Revision #{to} by itself: pick a line or a {word.toLowerCase()} on the chart to comment.</span> : d.same ? <span>The two revisions are the same.</span> : (
          <>
            {sizes.length > 1 && <span className="text-tide-600">All {sizes.length} sizes together:</span>}
            <span><strong className="tabular">{s.roundsChanged}</strong> {word.toLowerCase()}s changed</span>
            <span><strong className="tabular">{s.roundsAdded}</strong> added · <strong className="tabular">{s.roundsRemoved}</strong> removed</span>
            <span><strong className="tabular">{s.countsChanged}</strong> with new counts</span>
            <span><strong className="tabular">{s.cellsChanged}</strong> chart cells</span>
            <span className="text-samphire-800">+{s.linesAdded}</span><span className="text-glasswort-700">−{s.linesRemoved} lines</span>
            {s.diagnosticsIntroduced > 0 && <span className="text-glasswort-700">{s.diagnosticsIntroduced} problems introduced</span>}
            {s.diagnosticsFixed > 0 && <span className="text-samphire-800">{s.diagnosticsFixed} fixed</span>}
          </>
        )}
      </div>
      <div className="grid grid-cols-2 gap-0">
        <section aria-labelledby="src-h" className="min-w-0 border-r border-tide-200 bg-white">
          <h2 id="src-h" className="border-b border-tide-200 px-4 py-2 text-sm font-semibold">Source {single ? `of #${to}` : `#${from} → #${to}`}</h2>
          {text ? <TextDiffView text={text} from={from} to={to} commented={commentedLines} onCommentLine={(n) => setAnchor({ fromLine: n, toLine: n })} single={single} />
            : <p role="status" className="p-4 text-sm text-tide-600">Loading the source…</p>}
          {!single && <DiffFacts diff={d} />}
        </section>
        <section aria-labelledby="rounds-h" className="min-w-0 bg-white">
          <div className="flex flex-wrap items-center gap-3 border-b border-tide-200 px-4 py-2">
            <h2 id="rounds-h" className="text-sm font-semibold">{single ? `Comments and chart of #${to}` : `Changed ${word.toLowerCase()}s`}</h2>
            {sizes.length > 1 && (
              <div role="group" aria-label="Size" className="flex overflow-hidden rounded-stitch border border-tide-300 text-caption">
                {sizes.map((x) => (
                  <button key={x.size} type="button" aria-pressed={x === size} onClick={() => setSizeName(x.size)}
                    className={`px-2.5 py-1 font-medium ${x === size ? 'bg-lavender-700 text-white' : 'bg-white text-tide-800 hover:bg-tide-50'}`}>
                    {x.size}{!single && x.rounds.length > 0 ? ` (${x.rounds.length})` : ''}
                  </button>
                ))}
              </div>
            )}
          </div>
          {!size ? <p className="p-4 text-sm text-tide-600">Neither revision has a size both share, so there are no rounds to compare.</p> : (
            <>
              {!single && <RoundChanges size={size} commented={commentedRounds} selected={anchor?.round ?? null} onComment={(r) => setAnchor({ round: r })} />}
              <div className="border-t border-tide-200">
                <CommentThreads patternId={id} revision={to} word={word} anchor={anchor} onClearAnchor={() => setAnchor(null)} />
              </div>
              <div className="border-t border-tide-200">
                <DiffChart source={newer.data?.source ?? null} size={size} revision={to} single={single} onCommentRound={(r) => setAnchor({ round: r })} />
              </div>
            </>
          )}
        </section>
      </div>
    </div>
  );
}
