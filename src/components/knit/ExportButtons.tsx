/**
 * Export buttons (PDF, plain text, chart SVG and PNG) for one revision and
 * size. Exports run as server jobs; while one runs its progress shows as a
 * bar, and the file downloads when it is ready.
 */
import { useExport, type ExportFormat } from '../../api/useKnitting';
import { Notice } from '../Notice';

const FORMATS: { format: ExportFormat; label: string; what: string }[] = [
  { format: 'pdf', label: 'PDF', what: 'the whole pattern as PDF' },
  { format: 'txt', label: 'Text', what: 'the written instructions as plain text' },
  { format: 'svg', label: 'SVG', what: 'the chart as SVG' },
  { format: 'png', label: 'PNG', what: 'the chart as a PNG picture' },
];

export function ExportButtons({ patternId, revision, size }: { patternId: string; revision: number | null; size: string | null }) {
  const { state, start } = useExport(patternId, revision);
  const working = state.phase === 'working';
  const name = (f: ExportFormat) => FORMATS.find((x) => x.format === f)?.label ?? f;
  return (
    <div className="flex flex-wrap items-center gap-2" data-testid="exports">
      <div role="group" aria-label={`Export size ${size ?? ''}`} className="flex gap-1">
        <span className="self-center text-caption text-tide-600">Export</span>
        {FORMATS.map((f) => (
          <button key={f.format} type="button" className="btn btn-quiet btn-sm" disabled={working || revision === null}
            onClick={() => void start(f.format, size)} aria-label={`Export ${f.what}${size ? `, size ${size}` : ''}`}>
            {f.label}
          </button>
        ))}
      </div>
      {state.phase === 'working' && (
        <div className="flex items-center gap-2 text-caption text-tide-700" role="status">
          <span>Making the {name(state.format)}…</span>
          <div role="progressbar" aria-label={`${name(state.format)} export`} aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(state.progress * 100)}
            className="h-2 w-28 overflow-hidden rounded-full bg-tide-100">
            <div className="h-full bg-lavender-600 transition-[width]" style={{ width: `${Math.max(4, Math.round(state.progress * 100))}%` }} />
          </div>
          <span className="tabular">{Math.round(state.progress * 100)}%</span>
        </div>
      )}
      {state.phase === 'done' && <span role="status" className="text-caption text-samphire-800" data-testid="export-done">Downloaded {state.filename}</span>}
      {state.phase === 'failed' && <Notice tone="error" className="py-1">{name(state.format)} export failed: {state.message}</Notice>}
    </div>
  );
}
