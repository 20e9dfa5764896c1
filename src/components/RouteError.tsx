/** Shown when a page fails to load or render (for example a lost connection while fetching its code). */
import { isRouteErrorResponse, Link, useRouteError } from 'react-router';

export function RouteError() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : 'Unknown error';
  return (
    <div className="mx-auto mt-24 max-w-lg px-6">
      <h1 className="text-title text-tide-900">This page could not be shown</h1>
      <p className="mt-2 text-sm text-tide-700">
        Loopwright ran into a problem while opening it. Reloading usually helps; your unsaved pattern changes are kept in
        this browser.
      </p>
      <p className="mt-3 rounded-stitch bg-tide-100 px-3 py-2 font-mono text-caption text-tide-800">{message}</p>
      <div className="mt-4 flex gap-2">
        <button type="button" className="btn btn-primary" onClick={() => window.location.reload()}>Reload</button>
        <Link to="/patterns" className="btn btn-quiet">Back to patterns</Link>
      </div>
    </div>
  );
}
