/**
 * Account settings: the display name (changed in place; the top bar shows
 * the new one at once), the password (changed with the current one, or by a
 * mailed link when it is forgotten), and sign out.
 */
import { useNavigate } from 'react-router';
import { useMe, useSignOut } from '../api/useAuth';
import { errorText } from '../api/client';
import { NameForm } from '../components/account/NameForm';
import { PasswordForm } from '../components/account/PasswordForm';
import { Loading } from '../components/Loading';
import { Notice } from '../components/Notice';

export function Component() {
  const me = useMe();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const user = me.data;
  if (!user) return <Loading />;

  return (
    <div className="flex-1 overflow-auto">
      <div className="mx-auto max-w-2xl px-8 py-8">
        <h1 className="text-title text-tide-900">Account</h1>
        <NameForm key={user.id} user={user} />
        <PasswordForm user={user} />

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
