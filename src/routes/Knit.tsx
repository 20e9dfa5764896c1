/**
 * The knitter's view of a released version: pick the release and a size,
 * follow the written instructions with counts and the chart, keep your
 * place round by round (saved for you, per release and size), report an
 * erratum on a round, and export the pattern (PDF, text, SVG, PNG).
 */
import { useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router';
import type { ApiPattern } from '../../shared/api-schemas';
import { errorText } from '../api/client';
import { useProgress, useSaveProgress } from '../api/useKnitting';
import { usePattern } from '../api/usePatterns';
import { useReleases, useRevisionSource } from '../api/useReview';
import { fullTime, relativeTime } from '../components/format';
import { ErratumDialog } from '../components/knit/ErratumDialog';
import { ExportButtons } from '../components/knit/ExportButtons';
import { KnitChart } from '../components/knit/KnitChart';
import { currentOf, ProgressTracker } from '../components/knit/ProgressTracker';
import { Loading } from '../components/Loading';
import { Notice } from '../components/Notice';
import { PageHeader } from '../components/review/PageHeader';
import { useRendered } from '../components/review/useRendered';

export function Component() {
  const { id = '' } = useParams();
  const [params, setParams] = useSearchParams();
  const pattern = usePattern(id);
  const releases = useReleases(id);
  const release = releases.data?.find((r) => r.label === params.get('release')) ?? releases.data?.[0] ?? null;
  const source = useRevisionSource(id, release?.revision ?? null);
  const { answer } = useRendered(source.data?.source ?? null, params.get('size'), { instructions: true });
  const size = answer?.size ?? null;
  const label = release?.label ?? '';
  const progress = useProgress(id, release?.label ?? null, size);
  const saveProgress = useSaveProgress(id, label, size ?? '');
  const [reporting, setReporting] = useState<number | null>(null);
  const [thanks, setThanks] = useState<string | null>(null);
  const pick = (key: 'release' | 'size', value: string) => setParams((p) => { const q = new URLSearchParams(p); q.set(key, value); if (key === 'release') q.delete('size'); return q; }, { replace: true });

  if (pattern.isPending || releases.isPending) return <Loading label="Opening the pattern…" />;
  const failed = pattern.error ?? releases.error;
  if (failed || !pattern.data || !releases.data) {
    return (
      <div className="mx-auto mt-16 max-w-lg px-6">
        <h1 className="text-title">The pattern could not be opened</h1>
        <Notice tone="error" className="mt-3">{errorText(failed)}</Notice>
        <Link to="/patterns" className="btn btn-quiet mt-4">Back to patterns</Link>
      </div>
    );
  }
  const p = pattern.data.pattern as unknown as ApiPattern;
  const word = answer?.construction === 'flat' ? 'Row' : 'Round';
  const header = (
    <PageHeader patternId={id} title={p.title} status={p.status} role={p.myRole}
      subtitle={release ? <>Version {release.label} · released <span title={fullTime(release.releasedAt)}>{relativeTime(release.releasedAt)}</span> by {release.releasedBy.name}</> : 'Not released yet'} />
  );
  if (!release) {
    return <div className="min-h-0 flex-1 overflow-auto">{header}<div className="mx-auto max-w-lg p-6"><Notice tone="info">This pattern has no released version yet. Knitters see it once the designer releases an approved revision.</Notice></div></div>;
  }

  return (
    <div className="min-h-0 flex-1 overflow-auto">
      {header}
      <div className="flex flex-wrap items-center gap-4 border-b border-tide-200 bg-white px-4 py-2">
        {releases.data.length > 1 && (
          <label className="flex items-center gap-2 text-sm">
            <span>Version</span>
            <select className="field-input w-auto py-1" value={release.label} onChange={(e) => pick('release', e.target.value)}>
              {releases.data.map((r) => <option key={r.label} value={r.label}>{r.label}</option>)}
            </select>
          </label>
        )}
        {answer && answer.sizes.length > 0 && (
          <div role="group" aria-label="Size" className="flex overflow-hidden rounded-stitch border border-tide-300 text-sm">
            {answer.sizes.map((s) => (
              <button key={s} type="button" aria-pressed={s === size} onClick={() => pick('size', s)}
                className={`px-3 py-1 font-medium ${s === size ? 'bg-lavender-700 text-white' : 'bg-white text-tide-800 hover:bg-tide-50'}`}>
                Size {s}
              </button>
            ))}
          </div>
        )}
        <div className="ml-auto"><ExportButtons patternId={id} revision={release.revision} size={size} /></div>
      </div>
      {thanks && <Notice tone="success" className="mx-4 mt-3">{thanks}</Notice>}
      {saveProgress.isError && <Notice tone="error" className="mx-4 mt-3">Your place could not be saved: {errorText(saveProgress.error)}</Notice>}
      {source.isError ? <Notice tone="error" className="m-4">{errorText(source.error)}</Notice>
        : !answer ? <Loading label="Writing out the pattern…" />
          : !answer.instructions ? <Notice tone="warning" className="m-4">{answer.problem ?? 'This version has nothing to knit yet.'}</Notice>
            : (
              <div className="grid grid-cols-[minmax(0,1fr)_minmax(0,1fr)] gap-4 p-4">
                <div>
                  {progress.isPending ? <Loading label="Finding your place…" />
                    : progress.isError ? <Notice tone="error">{errorText(progress.error)}</Notice>
                      : (
                        <ProgressTracker instructions={answer.instructions} rounds={answer.rounds} progress={progress.data} word={word}
                          onSave={(v) => saveProgress.mutate(v)} onReport={setReporting} />
                      )}
                </div>
                <section aria-labelledby="chart-h" className="card self-start">
                  <h2 id="chart-h" className="border-b border-tide-200 px-4 py-2 text-sm font-semibold">Chart, size {size}</h2>
                  {answer.svg ? (
                    <KnitChart svg={answer.svg} word={word} current={progress.data ? currentOf(progress.data, answer.rounds.length) : null}
                      onPick={(r) => progress.data && saveProgress.mutate({ roundsDone: progress.data.roundsDone, currentRound: r })} />
                  ) : <p className="p-4 text-sm text-tide-600">{answer.problem ?? 'No chart for this size.'}</p>}
                </section>
              </div>
            )}
      <ErratumDialog patternId={id} label={label} size={size ?? ''} round={reporting} word={word}
        onClose={() => setReporting(null)} onSent={(m) => { setReporting(null); setThanks(m); }} />
    </div>
  );
}
