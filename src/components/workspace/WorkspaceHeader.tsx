/**
 * The workspace's top strip: back to the library, the pattern's title and
 * status, the revision being edited, the check status, and Save.
 */
import { Link } from 'react-router';
import type { Revision } from '../../api/types';
import type { CompiledView } from '../../editor/protocol';
import { fullTime, plural, relativeTime } from '../format';
import { StatusBadge } from '../StatusBadge';
import { keyLabel } from './shortcuts';

export interface WorkspaceHeaderProps {
  title: string;
  status: string;
  revision: Revision | null;
  baseRevision: number;
  dirty: boolean;
  view: CompiledView | null;
  checking: boolean;
  canEdit: boolean;
  onSave: () => void;
  onShowProblems: () => void;
  onHelp: () => void;
}

export function WorkspaceHeader(p: WorkspaceHeaderProps) {
  const errors = p.view?.diagnostics.filter((d) => d.severity === 'error').length ?? 0;
  const warnings = p.view?.diagnostics.filter((d) => d.severity === 'warning').length ?? 0;
  const sizes = p.view?.sizes.length ?? 0;
  return (
    <div className="flex h-14 shrink-0 items-center gap-4 border-b border-tide-200 bg-white px-4">
      <Link to="/patterns" className="shrink-0 whitespace-nowrap rounded-stitch px-1.5 py-1 text-sm text-tide-700 hover:bg-tide-100 hover:text-tide-900">
        <span aria-hidden="true">←</span> Patterns
      </Link>
      <div className="min-w-0 flex-1">
        <div className="flex items-center gap-2">
          <h1 className="truncate text-base font-semibold text-tide-900">{p.title || 'Untitled pattern'}</h1>
          <StatusBadge status={p.status} />
        </div>
        <p className="truncate text-caption text-tide-600" data-testid="revision-line">
          {p.revision && p.revision.number === p.baseRevision ? (
            <>
              Revision #{p.revision.number}
              {p.revision.author && <> by {p.revision.author.name}</>}
              {', '}
              <span title={fullTime(p.revision.createdAt)}>{relativeTime(p.revision.createdAt)}</span>
              {p.revision.message && <> — “{p.revision.message}”</>}
            </>
          ) : (
            <>Editing from revision #{p.baseRevision}</>
          )}
        </p>
      </div>

      <button
        type="button"
        onClick={p.onShowProblems}
        className={`flex shrink-0 items-center gap-2 whitespace-nowrap rounded-full border px-3 py-1 text-caption font-medium ${
          errors ? 'border-glasswort-200 bg-glasswort-50 text-glasswort-700'
            : warnings ? 'border-mudflat-200 bg-mudflat-50 text-mudflat-800'
              : 'border-samphire-200 bg-samphire-50 text-samphire-800'
        }`}
        aria-live="polite"
        data-testid="check-status"
      >
        {!p.view ? 'Checking…'
          : errors || warnings ? [errors && plural(errors, 'error'), warnings && plural(warnings, 'warning')].filter(Boolean).join(' · ')
            : `✓ Adds up${sizes > 1 ? ` in ${sizes} sizes` : ''}`}
        {p.checking && p.view && <span className="font-normal opacity-80">· rechecking</span>}
      </button>

      {p.dirty && (
        <span className="flex shrink-0 items-center gap-1.5 whitespace-nowrap text-caption text-mudflat-800" data-testid="unsaved">
          <span className="h-2 w-2 rounded-full bg-mudflat-500" aria-hidden="true" />
          Unsaved changes
        </span>
      )}
      <Link to="review" relative="path" className="btn btn-quiet btn-sm shrink-0" title="Revisions, review and releases">Review</Link>
      <button type="button" className="btn btn-quiet btn-sm shrink-0" onClick={p.onHelp} aria-keyshortcuts="F1" title="Keyboard shortcuts (F1)">
        <span aria-hidden="true">⌨</span>
        <span className="hidden xl:inline">Shortcuts</span>
        <span className="sr-only xl:hidden">Keyboard shortcuts</span>
      </button>
      {p.canEdit && (
        <button type="button" className="btn btn-primary shrink-0" onClick={p.onSave} aria-keyshortcuts="Control+S" title={`Save a revision (${keyLabel('Mod')}+S)`}>
          Save…
        </button>
      )}
    </div>
  );
}
