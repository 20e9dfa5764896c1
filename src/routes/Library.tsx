/**
 * The pattern library: every pattern the person may see, searchable by
 * title, filterable by status, sortable by column; new pattern and import
 * of a `.loop` file.
 */
import { useMemo, useRef, useState } from 'react';
import { useNavigate } from 'react-router';
import { useImportPattern, usePatternList } from '../api/usePatterns';
import { useMe } from '../api/useAuth';
import { errorText } from '../api/client';
import { Loading } from '../components/Loading';
import { Notice } from '../components/Notice';
import { NewPatternDialog } from '../components/NewPatternDialog';
import { PatternTable, sortPatterns, type Sort } from '../components/PatternTable';
import { statusLabel } from '../components/StatusBadge';

/** Largest source the server accepts (contract: 1 MB); checked here to answer at once. */
const MAX_IMPORT_BYTES = 1024 * 1024;

export function Component() {
  const list = usePatternList();
  const me = useMe();
  // Only designers (and admins) may create or import patterns; the server says 403 to anyone else.
  const canCreate = (me.data?.roles ?? []).some((r) => r === 'designer' || r === 'admin');
  const importPattern = useImportPattern();
  const navigate = useNavigate();
  const fileInput = useRef<HTMLInputElement>(null);
  const [query, setQuery] = useState('');
  const [status, setStatus] = useState('all');
  const [sort, setSort] = useState<Sort>({ key: 'updated', descending: true });
  const [creating, setCreating] = useState(false);
  const [importError, setImportError] = useState<string | null>(null);

  const rows = useMemo(() => list.data ?? [], [list.data]);
  const statuses = useMemo(() => [...new Set(rows.map((p) => p.status))].sort(), [rows]);
  const visible = useMemo(() => {
    const q = query.trim().toLowerCase();
    const filtered = rows.filter((p) => (status === 'all' || p.status === status) && (!q || p.title.toLowerCase().includes(q)));
    return sortPatterns(filtered, sort);
  }, [rows, query, status, sort]);

  const onFile = (file: File | undefined) => {
    setImportError(null);
    if (!file) return;
    if (!file.name.toLowerCase().endsWith('.loop')) {
      setImportError(`"${file.name}" is not a Loopwright source. Choose a file ending in .loop.`);
      return;
    }
    if (file.size > MAX_IMPORT_BYTES) {
      setImportError(`"${file.name}" is ${(file.size / 1048576).toFixed(1)} MB; sources can be at most 1 MB.`);
      return;
    }
    importPattern.mutate(file, {
      onSuccess: (data) => navigate(`/patterns/${data.pattern.id}`),
      onError: (err) => setImportError(errorText(err)),
    });
  };

  return (
    <div className="flex min-h-0 flex-1 flex-col overflow-auto">
      <div className="mx-auto w-full max-w-6xl px-8 py-8">
        <div className="flex items-end justify-between gap-4">
          <div>
            <h1 className="text-title text-tide-900">Patterns</h1>
            <p className="mt-1 text-sm text-tide-700">Everything you design, review or test-knit.</p>
          </div>
          {canCreate && <div className="flex gap-2">
            <input ref={fileInput} type="file" accept=".loop,text/plain" className="hidden" aria-hidden="true" tabIndex={-1}
              onChange={(e) => { onFile(e.target.files?.[0]); e.target.value = ''; }} />
            <button type="button" className="btn btn-quiet" onClick={() => fileInput.current?.click()} disabled={importPattern.isPending}>
              {importPattern.isPending ? 'Importing…' : 'Import .loop file'}
            </button>
            <button type="button" className="btn btn-primary" onClick={() => setCreating(true)}>New pattern</button>
          </div>}
        </div>

        {importError && <Notice tone="error" className="mt-4">{importError}</Notice>}

        <div className="mt-6 flex flex-wrap items-end gap-3">
          <div className="w-72">
            <label htmlFor="library-search" className="field-label">Search titles</label>
            <input id="library-search" type="search" className="field-input" placeholder="e.g. cowl" value={query} onChange={(e) => setQuery(e.target.value)} />
          </div>
          <div className="w-48">
            <label htmlFor="library-status" className="field-label">Status</label>
            <select id="library-status" className="field-input" value={status} onChange={(e) => setStatus(e.target.value)}>
              <option value="all">All statuses</option>
              {statuses.map((s) => <option key={s} value={s}>{statusLabel(s)}</option>)}
            </select>
          </div>
          {list.data && (
            <p className="ml-auto pb-2 text-caption text-tide-600" role="status">
              {visible.length === rows.length ? `${rows.length} pattern${rows.length === 1 ? '' : 's'}` : `${visible.length} of ${rows.length} shown`}
            </p>
          )}
        </div>

        <div className="card mt-3 overflow-hidden">
          {list.isPending ? (
            <Loading label="Loading your patterns…" />
          ) : list.isError ? (
            <div className="p-6">
              <Notice tone="error">{errorText(list.error)}</Notice>
              <button type="button" className="btn btn-quiet mt-3" onClick={() => void list.refetch()}>Try again</button>
            </div>
          ) : rows.length === 0 ? (
            <div className="px-8 py-14 text-center">
              <h2 className="text-base font-semibold text-tide-900">No patterns yet</h2>
              <p className="mx-auto mt-1 max-w-md text-sm text-tide-700">
                Start a new pattern and write its rounds in the editor, or import a .loop file you already have.
              </p>
              <button type="button" className="btn btn-primary mt-4" onClick={() => setCreating(true)}>Start a pattern</button>
            </div>
          ) : visible.length === 0 ? (
            <div className="px-8 py-10 text-center text-sm text-tide-700">
              No pattern matches {query.trim() ? <>“{query.trim()}”</> : 'this filter'}.{' '}
              <button type="button" className="font-medium text-lavender-700 underline" onClick={() => { setQuery(''); setStatus('all'); }}>
                Clear search and filter
              </button>
            </div>
          ) : (
            <PatternTable rows={visible} sort={sort} onSort={setSort} />
          )}
        </div>
      </div>
      <NewPatternDialog open={creating} onClose={() => setCreating(false)} />
    </div>
  );
}
