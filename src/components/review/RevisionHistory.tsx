/**
 * The revision history of a pattern: number, author, message, date,
 * errors and warnings, and marks for the revision in review, the approved
 * one and released ones (with their labels). Each row opens its changes
 * against the revision before it; two selects compare any two revisions.
 */
import { useState } from 'react';
import { Link, useNavigate } from 'react-router';
import type { ApiRelease, ApiRevision } from '../../../shared/api-schemas';
import type { ReviewState } from '../../api/useReview';
import { fullTime, plural, relativeTime } from '../format';

export interface RevisionHistoryProps {
  patternId: string;
  revisions: ApiRevision[];
  releases: ApiRelease[];
  review: ReviewState | null;
}

function Mark({ tone, children }: { tone: 'review' | 'approved' | 'released'; children: string }) {
  const cls = tone === 'review' ? 'border-mudflat-200 bg-mudflat-50 text-mudflat-800'
    : tone === 'approved' ? 'border-samphire-200 bg-samphire-50 text-samphire-800' : 'border-lavender-200 bg-lavender-100 text-lavender-800';
  return <span className={`inline-flex rounded-full border px-2 py-0.5 text-caption font-medium ${cls}`}>{children}</span>;
}

export function RevisionHistory({ patternId, revisions, releases, review }: RevisionHistoryProps) {
  const navigate = useNavigate();
  const newest = revisions[0]?.number ?? 1;
  const [from, setFrom] = useState(Math.max(1, newest - 1));
  const [to, setTo] = useState(newest);
  const inReview = review?.status === 'in-review' ? [...review.events].reverse().find((e) => e.event === 'submit')?.revision ?? null : null;
  const diffUrl = (a: number, b: number) => `/patterns/${patternId}/review/diff?from=${a}&to=${b}`;

  return (
    <section aria-labelledby="history-h" className="card">
      <div className="flex flex-wrap items-end gap-3 border-b border-tide-200 px-4 py-3">
        <h2 id="history-h" className="mr-auto text-sm font-semibold text-tide-900">Revision history</h2>
        <form className="flex items-end gap-2" onSubmit={(e) => { e.preventDefault(); navigate(diffUrl(from, to)); }}>
          <div>
            <label htmlFor="cmp-from" className="field-label">Compare</label>
            <select id="cmp-from" className="field-input py-1" value={from} onChange={(e) => setFrom(Number(e.target.value))}>
              {revisions.map((r) => <option key={r.number} value={r.number}>#{r.number}</option>)}
            </select>
          </div>
          <div>
            <label htmlFor="cmp-to" className="field-label">with</label>
            <select id="cmp-to" className="field-input py-1" value={to} onChange={(e) => setTo(Number(e.target.value))}>
              {revisions.map((r) => <option key={r.number} value={r.number}>#{r.number}</option>)}
            </select>
          </div>
          <button type="submit" className="btn btn-quiet">Show changes</button>
        </form>
      </div>
      {revisions.length === 0 ? (
        <p className="p-4 text-sm text-tide-600">No revisions yet.</p>
      ) : (
        <table className="w-full text-sm">
          <thead>
            <tr className="text-left text-caption uppercase tracking-wide text-tide-600">
              <th scope="col" className="px-4 py-2 font-semibold">Revision</th>
              <th scope="col" className="px-2 py-2 font-semibold">Message</th>
              <th scope="col" className="px-2 py-2 font-semibold">Problems</th>
              <th scope="col" className="px-2 py-2 font-semibold">Status</th>
              <th scope="col" className="px-4 py-2 text-right font-semibold"><span className="sr-only">Open</span></th>
            </tr>
          </thead>
          <tbody>
            {revisions.map((r) => {
              const released = releases.filter((x) => x.revision === r.number);
              return (
                <tr key={r.number} className="border-t border-tide-100 align-top" data-testid={`revision-${r.number}`}>
                  <td className="px-4 py-2.5">
                    <span className="font-semibold tabular">#{r.number}</span>
                    <span className="block text-caption text-tide-600">
                      {r.author.name} · <span title={fullTime(r.createdAt)}>{relativeTime(r.createdAt)}</span>
                    </span>
                  </td>
                  <td className="px-2 py-2.5 text-tide-800">{r.message || <span className="text-tide-500">No message</span>}</td>
                  <td className="px-2 py-2.5">
                    {r.errors === 0 && r.warnings === 0 ? <span className="text-samphire-700">✓ Adds up</span> : (
                      <span className="flex flex-wrap gap-1">
                        {r.errors > 0 && <span className="text-glasswort-700">{plural(r.errors, 'error')}</span>}
                        {r.warnings > 0 && <span className="text-mudflat-700">{plural(r.warnings, 'warning')}</span>}
                      </span>
                    )}
                  </td>
                  <td className="px-2 py-2.5">
                    <span className="flex flex-wrap gap-1">
                      {inReview === r.number && <Mark tone="review">In review</Mark>}
                      {review?.approvedRevision === r.number && <Mark tone="approved">Approved</Mark>}
                      {released.map((x) => <Mark key={x.label} tone="released">{`Released ${x.label}`}</Mark>)}
                    </span>
                  </td>
                  <td className="whitespace-nowrap px-4 py-2.5 text-right">
                    <Link className="font-medium text-lavender-800 hover:underline" to={diffUrl(Math.max(1, r.number - 1), r.number)}
                      aria-label={r.number > 1 ? `Changes in revision ${r.number} since ${r.number - 1}` : 'Open revision 1'}>
                      {r.number > 1 ? `Changes since #${r.number - 1}` : 'Open'}
                    </Link>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      )}
    </section>
  );
}
