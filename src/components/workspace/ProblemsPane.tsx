/**
 * Problems pane: every diagnostic of the newest compile, in source order,
 * with its code, message, size and place; a click moves the editor there.
 * Concrete quick fixes are offered as buttons beside the problem.
 */
import { memo, useMemo } from 'react';
import type { Diagnostic, Span } from '../../../shared';
import type { CompiledView } from '../../editor/protocol';
import { quickFixesFor, type QuickFix } from '../../editor/quick-fix';
import { Notice } from '../Notice';

const icon = { error: '✕', warning: '▲', info: 'i' } as const;
const iconClass = {
  error: 'bg-glasswort-600 text-white',
  warning: 'bg-mudflat-300 text-mudflat-900',
  info: 'bg-lavender-200 text-lavender-900',
} as const;
const severityWord = { error: 'Error', warning: 'Warning', info: 'Note' } as const;

export interface ProblemsPaneProps {
  view: CompiledView | null;
  /** True while the editor holds text newer than `view` (marks may shift). */
  stale: boolean;
  onJump: (span: Span) => void;
  onFix: (fix: QuickFix) => void;
}

export const ProblemsPane = memo(function ProblemsPane({ view, stale, onJump, onFix }: ProblemsPaneProps) {
  const sorted = useMemo(
    () =>
      [...(view?.diagnostics ?? [])].sort(
        (a, b) => a.span.from - b.span.from || (a.size ?? '').localeCompare(b.size ?? '') || a.code.localeCompare(b.code),
      ),
    [view],
  );
  if (!view) return <p className="p-5 text-sm text-tide-600" role="status">Checking the pattern…</p>;
  const errors = sorted.filter((d) => d.severity === 'error').length;
  const warnings = sorted.filter((d) => d.severity === 'warning').length;
  const sizes = view.sizes.map((s) => s.name);

  return (
    <div className="flex h-full min-h-0 flex-col">
      <div className="flex items-center gap-4 border-b border-tide-200 px-4 py-2 text-caption text-tide-700" aria-live="polite">
        <span><strong className="text-glasswort-700">{errors}</strong> error{errors === 1 ? '' : 's'}</span>
        <span><strong className="text-mudflat-700">{warnings}</strong> warning{warnings === 1 ? '' : 's'}</span>
        {stale && <span className="ml-auto text-tide-600">Rechecking…</span>}
      </div>
      {view.crash && (
        <Notice tone="error" className="m-4">
          The compiler stopped unexpectedly ({view.crash}). Your text is safe; this is a bug in Loopwright, please report it with the pattern.
        </Notice>
      )}
      {sorted.length === 0 && !view.crash ? (
        <div className="p-6 text-sm">
          <p className="font-semibold text-samphire-700">✓ No problems</p>
          <p className="mt-1 text-tide-700">
            Every round adds up{sizes.length ? ` in ${sizes.length === 1 ? `size ${sizes[0]}` : `all ${sizes.length} sizes (${sizes.join(', ')})`}` : ''}, and no float is over the limit.
          </p>
        </div>
      ) : (
        <ul className="min-h-0 flex-1 overflow-auto" aria-label="Problems">
          {sorted.map((d, i) => (
            <ProblemItem key={`${d.code}-${d.span.from}-${d.size ?? ''}-${i}`} d={d} source={view.source} onJump={onJump} onFix={onFix} />
          ))}
        </ul>
      )}
    </div>
  );
});

/** The message without its trailing "(size M)", which the meta line already shows. */
function withoutSize(d: Diagnostic): string {
  if (!d.size) return d.message;
  const tail = ` (size ${d.size})`;
  return d.message.endsWith(tail) ? d.message.slice(0, -tail.length) : d.message;
}

function ProblemItem({ d, source, onJump, onFix }: { d: Diagnostic; source: string; onJump: (s: Span) => void; onFix: (f: QuickFix) => void }) {
  const fixes = quickFixesFor(d, source);
  return (
    <li className="border-b border-tide-100" data-code={d.code}>
      <button type="button" onClick={() => onJump(d.span)} className="flex w-full gap-3 px-4 py-2.5 text-left hover:bg-lavender-50">
        <span aria-hidden="true" className={`mt-0.5 flex h-4.5 w-4.5 shrink-0 items-center justify-center rounded-full text-[10px] font-bold ${iconClass[d.severity]}`}>
          {icon[d.severity]}
        </span>
        <span className="min-w-0 flex-1">
          <span className="sr-only">{severityWord[d.severity]}: </span>
          <span className="block text-sm text-tide-900">{withoutSize(d)}</span>
          <span className="mt-0.5 flex flex-wrap gap-x-3 text-caption text-tide-600">
            <span className="font-mono">{d.code}</span>
            {d.size && <span>size {d.size}</span>}
            <span>line {d.span.line}, column {d.span.column}</span>
          </span>
          {d.hint && <span className="mt-1 block text-caption text-samphire-800">{d.hint}</span>}
        </span>
      </button>
      {fixes.length > 0 && (
        <div className="flex flex-wrap gap-2 px-4 pb-2.5 pl-11">
          {fixes.map((f) => (
            <button key={f.label} type="button" className="btn btn-quiet btn-sm" onClick={() => onFix(f)}>
              Fix: {f.label}
            </button>
          ))}
        </div>
      )}
    </li>
  );
}
