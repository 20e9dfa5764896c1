/**
 * The knitter's place: the current round with its instruction, counts and
 * note, "done, next" and "back" buttons, and the written instructions with
 * a toggle per round (done or not). Every change is saved through the API
 * for this knitter, release and size.
 */
import type { ApiProgress } from '../../../shared/api-schemas';
import type { Instructions, RenderedRound } from '../review/render-protocol';

export interface ProgressTrackerProps {
  instructions: Instructions;
  rounds: RenderedRound[];
  progress: ApiProgress;
  word: 'Round' | 'Row';
  onSave: (p: { roundsDone: number[]; currentRound: number | null }) => void;
  onReport: (round: number) => void;
}

/** The round to show as current: the saved one, else the first not done, else 1. */
export function currentOf(progress: Pick<ApiProgress, 'currentRound' | 'roundsDone'>, total: number): number {
  if (progress.currentRound !== null) return progress.currentRound;
  const done = new Set(progress.roundsDone);
  for (let n = 1; n <= total; n++) if (!done.has(n)) return n;
  return Math.max(1, total);
}

const countText = (r: RenderedRound | undefined) => !r ? '' : r.backing > 0 ? `${r.total} sts: ${r.front} + ${r.backing} backing` : `${r.total} sts`;

export function ProgressTracker({ instructions, rounds, progress, word, onSave, onReport }: ProgressTrackerProps) {
  const total = rounds.length;
  const done = new Set(progress.roundsDone);
  const current = currentOf(progress, total);
  const entry = instructions.entries.find((e) => current >= e.first && current <= e.last);
  const here = rounds[current - 1];
  const save = (roundsDone: number[], currentRound: number | null) => onSave({ roundsDone, currentRound });
  const markDone = () => {
    const next = Math.min(total, current + 1);
    save([...done, current], current >= total ? current : next);
  };
  const toggle = (n: number) => save(done.has(n) ? [...done].filter((x) => x !== n) : [...done, n], current);
  const w = word.toLowerCase();

  return (
    <div className="space-y-4">
      <section aria-labelledby="current-h" className="card border-lavender-300 p-4 shadow-sm" data-testid="current-round">
        <div className="flex items-baseline gap-2">
          <h2 id="current-h" className="text-lg font-semibold">{word} {current}</h2>
          <span className="text-caption text-tide-600">of {total} · {done.size} done{done.has(current) ? ` · this ${w} is done` : ''}</span>
        </div>
        <p className="mt-1 text-[0.95rem] leading-relaxed">{entry ? entry.text : 'No instruction for this round.'}</p>
        <p className="mt-1 text-sm font-medium text-samphire-800" data-testid="current-counts">After this {w}: {countText(here)}</p>
        {entry?.note && <p className="mt-1 text-sm italic text-tide-700">Note: {entry.note}</p>}
        <div className="mt-3 flex flex-wrap gap-2">
          <button type="button" className="btn btn-primary" onClick={markDone}>Mark {w} {current} done{current < total ? ', go to the next' : ''}</button>
          <button type="button" className="btn btn-quiet" disabled={current <= 1} onClick={() => save([...done], current - 1)}>Back one {w}</button>
          <label className="ml-auto flex items-center gap-1.5 text-sm">
            <span>Go to {w}</span>
            <input type="number" min={1} max={total} className="field-input w-20 py-1" key={current} defaultValue={current}
              onKeyDown={(e) => { if (e.key === 'Enter') { const n = Number(e.currentTarget.value); if (n >= 1 && n <= total) save([...done], n); } }}
              onBlur={(e) => { const n = Number(e.currentTarget.value); if (n >= 1 && n <= total && n !== current) save([...done], n); }} />
          </label>
          <button type="button" className="btn btn-quiet" onClick={() => onReport(current)}>Report a problem</button>
        </div>
      </section>

      <section aria-labelledby="ins-h" className="card p-4">
        <h2 id="ins-h" className="text-sm font-semibold">Instructions, size {instructions.size}</h2>
        <p className="mt-2 text-sm">{instructions.castOn}</p>
        <ol className="mt-2 space-y-2 text-sm">
          {instructions.entries.map((e) => {
            const isHere = current >= e.first && current <= e.last;
            const nums = Array.from({ length: e.last - e.first + 1 }, (_, i) => e.first + i);
            return (
              <li key={`${e.first}-${e.last}`} className={`rounded-stitch px-2 py-1.5 ${isHere ? 'bg-lavender-50 shadow-[inset_3px_0_0] shadow-lavender-600' : ''}`}>
                <span className="font-semibold">{e.label}:</span> {e.text}
                {e.counts && <span className="ml-1 whitespace-nowrap font-medium text-samphire-800">({e.counts.backing > 0 ? `${e.counts.total} sts: ${e.counts.front} + ${e.counts.backing} backing` : `${e.counts.total} sts`})</span>}
                {e.note && <span className="block text-caption italic text-tide-700">Note: {e.note}</span>}
                <span className="mt-1 flex flex-wrap gap-1" role="group" aria-label={`${e.label}: ${w}s done`}>
                  {nums.map((n) => (
                    <button key={n} type="button" aria-pressed={done.has(n)}
                      aria-label={`${word} ${n} done${n === current ? ' (current)' : ''}`} onClick={() => toggle(n)}
                      className={`min-w-8 rounded-stitch border px-1.5 text-caption tabular ${done.has(n) ? 'border-samphire-300 bg-samphire-100 text-samphire-900' : 'border-tide-300 bg-white text-tide-800 hover:bg-tide-50'} ${n === current ? 'ring-2 ring-lavender-600' : ''}`}>
                      {done.has(n) ? '✓' : ''}{n}
                    </button>
                  ))}
                </span>
              </li>
            );
          })}
        </ol>
        {instructions.key.length > 0 && (
          <dl className="mt-4 grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-caption">
            {instructions.key.map((k) => <div key={k.abbreviation} className="contents"><dt className="font-mono font-semibold">{k.abbreviation}</dt><dd>{k.meaning}</dd></div>)}
          </dl>
        )}
      </section>
    </div>
  );
}
