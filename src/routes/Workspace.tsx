/** The pattern workspace page: loads the pattern, then hands over to the studio view. */
import { Link, Navigate, useParams, useSearchParams } from 'react-router';
import { usePattern } from '../api/usePatterns';
import { errorText, isApiStatus } from '../api/client';
import { Loading } from '../components/Loading';
import { Notice } from '../components/Notice';
import { WorkspaceView } from '../components/workspace/WorkspaceView';

export function Component() {
  const { id = '' } = useParams();
  const pattern = usePattern(id);
  const [params] = useSearchParams();
  // Links in review mails: a release opens the knitter's view, a revision (an erratum) its review page.
  const release = params.get('release');
  const revision = Number(params.get('revision'));
  if (release) return <Navigate to={`/patterns/${id}/knit?release=${encodeURIComponent(release)}`} replace />;
  if (Number.isInteger(revision) && revision > 0) return <Navigate to={`/patterns/${id}/review/diff?from=${Math.max(1, revision - 1)}&to=${revision}`} replace />;
  if (pattern.isPending) return <Loading label="Opening the pattern…" />;
  if (pattern.isError) {
    const missing = isApiStatus(pattern.error, 404) || isApiStatus(pattern.error, 403);
    return (
      <div className="mx-auto mt-16 max-w-lg px-6">
        <h1 className="text-title text-tide-900">{missing ? 'Pattern not found' : 'The pattern could not be opened'}</h1>
        <Notice tone="error" className="mt-3">
          {missing ? 'It does not exist, or it has not been shared with you.' : errorText(pattern.error)}
        </Notice>
        <div className="mt-4 flex gap-2">
          {!missing && <button type="button" className="btn btn-primary" onClick={() => void pattern.refetch()}>Try again</button>}
          <Link to="/patterns" className="btn btn-quiet">Back to patterns</Link>
        </div>
      </div>
    );
  }
  const role = pattern.data.pattern.myRole;
  if (role === 'knitter' || role === 'test-knitter') return <Navigate to={`/patterns/${id}/knit`} replace />;
  return <WorkspaceView key={id} patternId={id} pattern={pattern.data.pattern} latest={pattern.data.latestRevision} />;
}
