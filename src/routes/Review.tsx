/**
 * The review page of a pattern (owner and editors): where the review
 * stands and the next step, the revision history with status marks and
 * comparisons, releases, the people on the pattern and the review log.
 */
import { Link, useParams } from 'react-router';
import type { ApiPattern } from '../../shared/api-schemas';
import { errorText, isApiStatus } from '../api/client';
import { usePattern } from '../api/usePatterns';
import { useReleases, useReviewState, useRevisionList } from '../api/useReview';
import { fullTime, relativeTime } from '../components/format';
import { Loading } from '../components/Loading';
import { Notice } from '../components/Notice';
import { MembersCard } from '../components/review/MembersCard';
import { PageHeader } from '../components/review/PageHeader';
import { ReviewActions } from '../components/review/ReviewActions';
import { RevisionHistory } from '../components/review/RevisionHistory';

const eventWords = { submit: 'asked for a review of', withdraw: 'withdrew the review request', approve: 'approved', 'request-changes': 'asked for changes to', release: 'released' } as const;

export function Component() {
  const { id = '' } = useParams();
  const pattern = usePattern(id);
  const review = useReviewState(id);
  const revisions = useRevisionList(id);
  const releases = useReleases(id);

  if (pattern.isPending) return <Loading label="Opening the review…" />;
  if (pattern.isError) {
    return (
      <div className="mx-auto mt-16 max-w-lg px-6">
        <h1 className="text-title">The review could not be opened</h1>
        <Notice tone="error" className="mt-3">{isApiStatus(pattern.error, 404) ? 'This pattern does not exist or is not shared with you.' : errorText(pattern.error)}</Notice>
        <Link to="/patterns" className="btn btn-quiet mt-4">Back to patterns</Link>
      </div>
    );
  }
  const p = pattern.data.pattern as unknown as ApiPattern;
  const role = p.myRole;
  const failed = review.error ?? revisions.error ?? releases.error;

  return (
    <div className="min-h-0 flex-1 overflow-auto">
      <PageHeader patternId={id} title={p.title} status={review.data?.status ?? p.status} role={role} subtitle="Review, releases and revision history" />
      {role !== 'owner' && role !== 'editor' ? (
        <div className="mx-auto max-w-lg p-6">
          <Notice tone="info">Reviews are for the designer and invited technical editors. <Link className="underline" to={`/patterns/${id}/knit`}>Open the released pattern</Link>.</Notice>
        </div>
      ) : failed ? (
        <div className="mx-auto max-w-lg p-6"><Notice tone="error">{errorText(failed)}</Notice></div>
      ) : !review.data || !revisions.data || !releases.data ? (
        <Loading label="Loading the review…" />
      ) : (
        <div className="mx-auto grid max-w-6xl grid-cols-[minmax(0,1fr)_22rem] gap-4 p-4">
          <div className="space-y-4">
            <ReviewActions patternId={id} role={role} review={review.data} revisions={revisions.data} releases={releases.data} />
            <RevisionHistory patternId={id} revisions={revisions.data} releases={releases.data} review={review.data} />
          </div>
          <div className="space-y-4">
            <section aria-labelledby="releases-h" className="card p-4">
              <h2 id="releases-h" className="text-sm font-semibold text-tide-900">Releases</h2>
              {releases.data.length === 0 ? <p className="mt-2 text-sm text-tide-600">Nothing released yet.</p> : (
                <ul className="mt-2 space-y-2 text-sm">
                  {releases.data.map((r) => (
                    <li key={r.label}>
                      <Link to={`/patterns/${id}/knit?release=${encodeURIComponent(r.label)}`} className="font-semibold text-lavender-800 hover:underline">Version {r.label}</Link>
                      <span className="text-tide-600"> · revision #{r.revision} · <span title={fullTime(r.releasedAt)}>{relativeTime(r.releasedAt)}</span></span>
                      {r.notes && <span className="block text-caption text-tide-700">{r.notes}</span>}
                      <Link to={`/patterns/${id}/review/diff?from=${Math.max(1, r.revision - 1)}&to=${r.revision}`} className="block text-caption text-lavender-800 hover:underline">
                        Comments and errata on revision #{r.revision}
                      </Link>
                    </li>
                  ))}
                </ul>
              )}
            </section>
            <MembersCard patternId={id} isOwner={role === 'owner'} />
            <section aria-labelledby="log-h" className="card p-4">
              <h2 id="log-h" className="text-sm font-semibold text-tide-900">Review log</h2>
              {review.data.events.length === 0 ? <p className="mt-2 text-sm text-tide-600">No review steps yet.</p> : (
                <ol className="mt-2 space-y-2 text-sm">
                  {[...review.data.events].reverse().map((e) => (
                    <li key={e.id}>
                      <span className="font-medium">{e.actor.name}</span> {eventWords[e.event]}{e.revision !== null && e.event !== 'withdraw' ? ` revision #${e.revision}` : ''}
                      <span className="text-tide-600"> · <span title={fullTime(e.createdAt)}>{relativeTime(e.createdAt)}</span></span>
                      {e.message && <span className="block text-caption text-tide-700">“{e.message}”</span>}
                    </li>
                  ))}
                </ol>
              )}
            </section>
          </div>
        </div>
      )}
    </div>
  );
}
