/** Any unknown address. */
import { Link } from 'react-router';

export function Component() {
  return (
    <div className="mx-auto mt-24 max-w-lg px-6 text-center">
      <p className="font-mono text-sm text-lavender-700">404</p>
      <h1 className="mt-1 text-title text-tide-900">No page here</h1>
      <p className="mt-2 text-sm text-tide-700">The address may be mistyped, or the page has moved.</p>
      <Link to="/patterns" className="btn btn-primary mt-5">Go to your patterns</Link>
    </div>
  );
}
