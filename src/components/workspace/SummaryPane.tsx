/**
 * Summary pane: for every size the finished size, the rounds worked, a yarn
 * estimate per colour and the floats over the limit (from shared/render's
 * summary, computed in the compile worker), the gauge's yarn weight, what
 * could not be said and the trade's cautions; and the backing-stitch
 * planner: propose ladder columns for a range of rounds and insert them into
 * the source with one click (an ordinary, undoable edit).
 */
import { memo, useState, type FormEvent } from 'react';
import type { PlanAnswer } from '../../editor/protocol';
import { useSummary } from '../../editor/useSummary';
import { Notice } from '../Notice';

type Dual = { cm: number; in: number };
const len = (d: Dual) => `${d.cm.toFixed(1)} cm (${d.in.toFixed(1)} in)`;
const whole = (n: number) => Math.ceil(n).toLocaleString();

export interface SummaryPaneProps {
  /** The newest text the compile worker checked (the summary follows it). */
  compiled: { id: number; source: string } | null;
  /** Replace the text with the planner's patched source; false when the text changed since the plan. */
  onInsert: (plan: PlanAnswer) => boolean;
  word: 'Round' | 'Row';
}

export const SummaryPane = memo(function SummaryPane({ compiled, onInsert, word }: SummaryPaneProps) {
  // The summary worker lives while this pane shows.
  const { summary: message, plan, requestPlan: onPlan } = useSummary(true, compiled);
  const sum = message?.summary ?? null;
  const over = sum?.sizes.flatMap((s) => s.floats.filter((f) => f.isOverLimit)) ?? [];
  const defaultFirst = over.length ? Math.min(...over.map((f) => f.round)) : 1;
  const defaultLast = over.length ? Math.max(...over.map((f) => f.round)) : 1;
  const [range, setRange] = useState<{ first: string; last: string; segment: string } | null>(null);
  const [insertError, setInsertError] = useState<string | null>(null);
  const first = range?.first ?? String(defaultFirst);
  const last = range?.last ?? String(defaultLast);
  const segment = range?.segment ?? '';
  const w = word.toLowerCase();

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setInsertError(null);
    onPlan(Number(first), Number(last), segment.trim() || undefined);
  };

  if (!message) return <p className="p-5 text-sm text-tide-600" role="status">Summarising…</p>;
  if (!sum) return <p className="p-5 text-sm text-tide-700">{message.problem}</p>;

  return (
    <div className="h-full overflow-auto px-5 py-4 text-sm text-tide-900" data-testid="summary">
      {sum.yarnWeight && <p className="text-tide-800">{sum.yarnWeight.message}</p>}
      {sum.floatLimitStitches !== null && (
        <p className="mt-1 text-caption text-tide-700">Floats longer than {sum.floatLimitStitches.toFixed(1)} sts go over the limit at this gauge.</p>
      )}
      <div className="mt-4 grid gap-3" style={{ gridTemplateColumns: `repeat(${Math.min(3, Math.max(1, sum.sizes.length))}, minmax(0, 1fr))` }}>
        {sum.sizes.map((s) => {
          const long = s.floats.filter((f) => f.isOverLimit);
          return (
            <section key={s.name} aria-label={`Size ${s.name}`} className="rounded-stitch border border-tide-200 p-3">
              <h3 className="font-semibold">Size {s.name}</h3>
              <dl className="mt-2 space-y-1 text-caption">
                {s.finished ? (
                  <>
                    <div><dt className="inline text-tide-700">{s.finished.widthKind === 'circumference' ? 'Circumference' : 'Width'}: </dt><dd className="inline font-medium">{len(s.finished.width)}</dd></div>
                    <div><dt className="inline text-tide-700">Length: </dt><dd className="inline font-medium">{len(s.finished.length)}</dd></div>
                  </>
                ) : null}
                <div><dt className="inline text-tide-700">Worked: </dt><dd className="inline">{s.roundsWorked} {w}s, {s.mainFrontStitches} front sts</dd></div>
              </dl>
              {s.yarn && (
                <ul className="mt-2 space-y-0.5 text-caption" aria-label="Yarn estimate">
                  {s.yarn.amounts.map((a) => (
                    <li key={a.yarn}><span className="font-semibold">{a.yarn}</span>: about {whole(a.metresWithAllowance)} m ({whole(a.yardsWithAllowance)} yd)</li>
                  ))}
                </ul>
              )}
              <p className={`mt-2 text-caption ${long.length ? 'font-medium text-glasswort-700' : 'text-samphire-700'}`}>
                {long.length ? `${long.length} float${long.length === 1 ? '' : 's'} over the limit, longest ${Math.max(...long.map((f) => f.stitches))} sts` : 'No float over the limit'}
              </p>
            </section>
          );
        })}
      </div>
      {sum.yarnAssumption && <p className="mt-3 text-caption text-tide-700">Yarn amounts include a 10 % allowance. {sum.yarnAssumption}</p>}
      {sum.gaps.map((g) => <p key={g} className="mt-2 text-caption text-mudflat-800">{g}</p>)}

      <section aria-labelledby="planner-title" className="mt-5 rounded-stitch border border-lavender-200 bg-lavender-50 p-4">
        <h3 id="planner-title" className="font-semibold">Backing-stitch planner</h3>
        <p className="mt-1 text-caption text-tide-700">
          Proposes ladder columns so no float in the chosen {w}s is longer than the limit, and checks the result by compiling it.
        </p>
        <form onSubmit={submit} className="mt-3 flex flex-wrap items-end gap-3">
          <label className="text-caption">
            <span className="field-label">First {w}</span>
            <input type="number" min={1} className="field-input w-24" value={first} onChange={(e) => setRange({ first: e.target.value, last, segment })} />
          </label>
          <label className="text-caption">
            <span className="field-label">Last {w}</span>
            <input type="number" min={1} className="field-input w-24" value={last} onChange={(e) => setRange({ first, last: e.target.value, segment })} />
          </label>
          <label className="text-caption">
            <span className="field-label">Segment (optional)</span>
            <input className="field-input w-32" value={segment} onChange={(e) => setRange({ first, last, segment: e.target.value })} placeholder="e.g. back" />
          </label>
          <button type="submit" className="btn btn-primary btn-sm">Propose columns</button>
        </form>
        {plan && (
          <div className="mt-3 space-y-2" aria-live="polite">
            {plan.problem && <Notice tone="error">{plan.problem}</Notice>}
            {plan.plan?.problems.map((p) => <Notice key={p} tone="warning">{p}</Notice>)}
            {plan.plan && plan.plan.ladderSource && (
              <>
                <p className="text-caption">
                  {plan.plan.ok ? '✓ With these columns every float in the range is within the limit.' : 'These columns do not remove every long float (see above).'}
                  {plan.plan.before.length > 0 && ` Before: ${plan.plan.before.length} long float${plan.plan.before.length === 1 ? '' : 's'}; after: ${plan.plan.after.length}.`}
                </p>
                <pre className="overflow-auto rounded-stitch border border-tide-200 bg-white p-2 font-mono text-caption">{plan.plan.ladderSource}</pre>
                {insertError && <Notice tone="warning">{insertError}</Notice>}
                <button type="button" className="btn btn-quiet btn-sm"
                  onClick={() => setInsertError(onInsert(plan) ? null : 'The text changed since this proposal; propose again.')}>
                  Insert into the source
                </button>
              </>
            )}
            {plan.plan && !plan.plan.ladderSource && plan.plan.problems.length === 0 && (
              <p className="text-caption text-samphire-800">No float in {w}s {first}–{last} is over the limit; nothing to add.</p>
            )}
          </div>
        )}
      </section>

      {sum.cautions.length > 0 && (
        <section className="mt-5" aria-label="Cautions">
          <h3 className="text-caption font-semibold uppercase tracking-wide text-tide-600">Cautions</h3>
          <ul className="mt-1 list-disc space-y-1 pl-5 text-caption text-tide-800">{sum.cautions.map((c) => <li key={c}>{c}</li>)}</ul>
        </section>
      )}
    </div>
  );
});
