/**
 * The library table: one row per pattern with status, sizes, last revision,
 * problem counts and last update. Column headers sort (click again to
 * reverse) and announce the order through aria-sort.
 */
import { Link } from 'react-router';
import type { PatternListItem } from '../api/types';
import { fullTime, plural, relativeTime } from './format';
import { StatusBadge } from './StatusBadge';

/** Columns the table can sort by. */
export type SortKey = 'title' | 'status' | 'revision' | 'problems' | 'updated';
/** A sort order: column and direction. */
export interface Sort { key: SortKey; descending: boolean }

/** Compare two rows for the given column, ascending. */
function compareBy(key: SortKey, a: PatternListItem, b: PatternListItem): number {
  switch (key) {
    case 'title': return a.title.localeCompare(b.title, undefined, { sensitivity: 'base' });
    case 'status': return a.status.localeCompare(b.status);
    case 'revision': return a.latestRevision - b.latestRevision;
    case 'problems': return a.errors - b.errors || a.warnings - b.warnings;
    case 'updated': return Date.parse(a.updatedAt) - Date.parse(b.updatedAt);
  }
}

/** Rows sorted by `sort`, title as the tie-breaker; never mutates the input. */
export function sortPatterns(rows: readonly PatternListItem[], sort: Sort): PatternListItem[] {
  return [...rows].sort((a, b) => {
    const c = compareBy(sort.key, a, b) || compareBy('title', a, b);
    return sort.descending ? -c : c;
  });
}

const columns: { key: SortKey | null; label: string; className?: string }[] = [
  { key: 'title', label: 'Title' },
  { key: 'status', label: 'Status' },
  { key: null, label: 'Sizes' },
  { key: 'revision', label: 'Last revision' },
  { key: 'problems', label: 'Problems' },
  { key: 'updated', label: 'Updated', className: 'text-right' },
];

export function PatternTable({ rows, sort, onSort }: { rows: PatternListItem[]; sort: Sort; onSort: (s: Sort) => void }) {
  return (
    <table className="w-full border-separate border-spacing-0 text-sm">
      <thead>
        <tr>
          {columns.map((col) => {
            const active = col.key !== null && sort.key === col.key;
            return (
              <th
                key={col.label}
                scope="col"
                aria-sort={active ? (sort.descending ? 'descending' : 'ascending') : undefined}
                className={`sticky top-0 border-b border-tide-200 bg-tide-50 px-4 py-2 text-left text-caption font-semibold uppercase tracking-wide text-tide-700 ${col.className ?? ''}`}
              >
                {col.key ? (
                  <button
                    type="button"
                    className="inline-flex items-center gap-1 rounded-stitch uppercase hover:text-tide-900"
                    onClick={() => onSort({ key: col.key as SortKey, descending: active ? !sort.descending : col.key === 'updated' })}
                  >
                    {col.label}
                    <span aria-hidden="true" className={active ? 'text-lavender-700' : 'text-tide-300'}>
                      {active && sort.descending ? '↓' : '↑'}
                    </span>
                  </button>
                ) : (
                  col.label
                )}
              </th>
            );
          })}
        </tr>
      </thead>
      <tbody>
        {rows.map((p) => (
          <tr key={p.id} className="group hover:bg-lavender-50/60">
            <td className="border-b border-tide-100 px-4 py-3">
              <Link to={`/patterns/${p.id}`} className="font-medium text-lavender-800 hover:underline">
                {p.title || 'Untitled pattern'}
              </Link>
              {p.myRole !== 'owner' && <span className="ml-2 text-caption text-tide-600">({p.myRole.replace('-', ' ')})</span>}
            </td>
            <td className="border-b border-tide-100 px-4 py-3"><StatusBadge status={p.status} /></td>
            <td className="border-b border-tide-100 px-4 py-3 text-tide-800">
              {p.sizes.length ? p.sizes.join(' · ') : <span className="text-tide-600">—</span>}
            </td>
            <td className="border-b border-tide-100 px-4 py-3 text-tide-800">
              <span className="tabular">#{p.latestRevision}</span>
              {p.latestAuthor && <span className="text-tide-600"> by {p.latestAuthor.name}</span>}
            </td>
            <td className="border-b border-tide-100 px-4 py-3">
              {p.errors === 0 && p.warnings === 0 ? (
                <span className="text-samphire-700">✓ Adds up</span>
              ) : (
                <span className="flex flex-wrap gap-1.5">
                  {p.errors > 0 && <span className="rounded-full bg-glasswort-50 px-2 py-0.5 text-caption font-medium text-glasswort-700">{plural(p.errors, 'error')}</span>}
                  {p.warnings > 0 && <span className="rounded-full bg-mudflat-50 px-2 py-0.5 text-caption font-medium text-mudflat-700">{plural(p.warnings, 'warning')}</span>}
                </span>
              )}
            </td>
            <td className="border-b border-tide-100 px-4 py-3 text-right text-tide-700" title={fullTime(p.updatedAt)}>
              {relativeTime(p.updatedAt)}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
