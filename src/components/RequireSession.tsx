/**
 * Layout route that lets its pages render only for a signed-in person;
 * anyone else goes to the sign-in page, which brings them back afterwards.
 */
import { Navigate, Outlet, useLocation } from 'react-router';
import { useMe } from '../api/useAuth';
import { errorText } from '../api/client';
import { Loading } from './Loading';
import { Notice } from './Notice';

export function RequireSession() {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <Loading label="Checking your session…" />;
  if (me.isError) {
    return (
      <div className="mx-auto mt-16 w-form">
        <Notice tone="error">{errorText(me.error)}</Notice>
        <button type="button" className="btn btn-quiet mt-3" onClick={() => void me.refetch()}>Try again</button>
      </div>
    );
  }
  if (!me.data) {
    const next = location.pathname + location.search;
    return <Navigate to={`/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }
  return <Outlet />;
}
