/**
 * Account settings: who you are signed in as, a password change by mailed
 * link (the API changes passwords only through the reset link), sign out.
 */
import { useNavigate } from 'react-router';
import { useMe, useRequestPasswordReset, useSignOut } from '../api/useAuth';
import { errorText } from '../api/client';
import { Loading } from '../components/Loading';
import { Notice } from '../components/Notice';

function roleLabel(role: string): string {
  if (role === 'editor' || role === 'technical-editor') return 'Technical editor';
  return role.replace(/[-_]+/g, ' ').replace(/^./, (c) => c.toUpperCase());
}

export function Component() {
  const me = useMe();
  const signOut = useSignOut();
  const reset = useRequestPasswordReset();
  const navigate = useNavigate();
  const user = me.data;
  if (!user) return <Loading />;

  return (
    <div className="flex-1 overflow-auto">
      <div className="mx-auto max-w-2xl px-8 py-8">
        <h1 className="text-title text-tide-900">Account</h1>
        <section aria-labelledby="acct-profile" className="card mt-6 p-6">
          <h2 id="acct-profile" className="text-base font-semibold">Profile</h2>
          <dl className="mt-4 grid grid-cols-[9rem_1fr] gap-y-3 text-sm">
            <dt className="text-tide-700">Name</dt><dd className="font-medium">{user.name}</dd>
            <dt className="text-tide-700">E-mail</dt><dd className="font-medium">{user.email}</dd>
            <dt className="text-tide-700">Roles</dt>
            <dd className="flex flex-wrap gap-1.5">
              {user.roles.length ? user.roles.map((r) => (
                <span key={r} className="rounded-full border border-lavender-200 bg-lavender-50 px-2 py-0.5 text-caption font-medium text-lavender-800">{roleLabel(r)}</span>
              )) : <span className="text-tide-600">No account roles; access is granted per pattern.</span>}
            </dd>
          </dl>
        </section>

        <section aria-labelledby="acct-password" className="card mt-4 p-6">
          <h2 id="acct-password" className="text-base font-semibold">Password</h2>
          <p className="mt-1 text-sm text-tide-700">
            To change your password, we e-mail you a link to {user.email}; open it and choose a new one.
          </p>
          {reset.isError && <Notice tone="error" className="mt-3">{errorText(reset.error)}</Notice>}
          {reset.isSuccess ? (
            <Notice tone="success" className="mt-3">The link is on its way to {user.email}.</Notice>
          ) : (
            <button type="button" className="btn btn-quiet mt-4" disabled={reset.isPending} onClick={() => reset.mutate({ email: user.email })}>
              {reset.isPending ? 'Sending…' : 'E-mail me a password link'}
            </button>
          )}
        </section>

        <section aria-labelledby="acct-session" className="card mt-4 p-6">
          <h2 id="acct-session" className="text-base font-semibold">Session</h2>
          <p className="mt-1 text-sm text-tide-700">Unsaved pattern changes stay in this browser after you sign out.</p>
          {signOut.isError && <Notice tone="error" className="mt-3">{errorText(signOut.error)}</Notice>}
          <button type="button" className="btn btn-danger mt-4" disabled={signOut.isPending}
            onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate('/sign-in', { replace: true }) })}>
            {signOut.isPending ? 'Signing out…' : 'Sign out'}
          </button>
        </section>
      </div>
    </div>
  );
}
