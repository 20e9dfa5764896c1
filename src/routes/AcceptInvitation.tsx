/**
 * Invitation link landing. Shows who invited whom to which pattern, then:
 * - no account for the invited address: choose a name and password, accept
 *   (the account is created and signed in);
 * - an account exists: sign in as it (and come back), then accept.
 */
import { useState, type FormEvent } from 'react';
import { useLocation, useNavigate, useParams } from 'react-router';
import { useAcceptInvitation, useInvitation, useMe, useSignOut } from '../api/useAuth';
import { errorText, isApiStatus } from '../api/client';
import { AuthFrame, AuthLink } from '../components/AuthFrame';
import { Field } from '../components/Field';
import { Loading } from '../components/Loading';
import { Notice } from '../components/Notice';
import { MIN_PASSWORD } from '../components/password';

const roleWords: Record<string, string> = { editor: 'technical editor', 'test-knitter': 'test knitter', knitter: 'knitter' };

export function Component() {
  const { token = '' } = useParams();
  const invitation = useInvitation(token);
  const me = useMe();
  const accept = useAcceptInvitation();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const location = useLocation();
  const [name, setName] = useState('');
  const [password, setPassword] = useState('');
  const [touched, setTouched] = useState(false);

  if (invitation.isPending || me.isPending) return <Loading label="Opening the invitation…" />;
  if (invitation.isError) {
    const gone = isApiStatus(invitation.error, 410) || isApiStatus(invitation.error, 404);
    return (
      <AuthFrame title="This invitation cannot be used" footer={<p><AuthLink to="/sign-in">Go to sign in</AuthLink></p>}>
        <Notice tone="error">{gone ? errorText(invitation.error) : `The invitation could not be loaded. ${errorText(invitation.error)}`}</Notice>
      </AuthFrame>
    );
  }
  const inv = invitation.data;
  const role = roleWords[inv.role] ?? inv.role;
  const lead = <>{inv.invitedBy || 'A designer'} invited <strong>{inv.email}</strong> to <strong>{inv.patternTitle || 'a pattern'}</strong> as {role}.</>;
  const done = (data: { patternId: number | string }) => navigate(`/patterns/${data.patternId}`, { replace: true });
  const here = encodeURIComponent(location.pathname);

  if (!inv.accountExists) {
    const submit = (e: FormEvent) => {
      e.preventDefault();
      setTouched(true);
      if (!name.trim() || password.length < MIN_PASSWORD) return;
      accept.mutate({ token, name: name.trim(), password }, { onSuccess: done });
    };
    return (
      <AuthFrame title="Accept the invitation" lead={lead}>
        <form onSubmit={submit} className="space-y-4" noValidate>
          <p className="text-sm text-tide-700">Choose your name and a password to create your account for {inv.email}.</p>
          {accept.isError && <Notice tone="error">{errorText(accept.error)}</Notice>}
          <Field label="Your name" autoComplete="name" value={name} onChange={(e) => setName(e.target.value)} autoFocus
            error={touched && !name.trim() ? 'Enter the name the designer will see.' : null} />
          <Field label="Password" type="password" autoComplete="new-password" value={password} onChange={(e) => setPassword(e.target.value)}
            help={`At least ${MIN_PASSWORD} characters.`} error={touched && password.length < MIN_PASSWORD ? `Use at least ${MIN_PASSWORD} characters.` : null} />
          <button type="submit" className="btn btn-primary w-full" disabled={accept.isPending}>
            {accept.isPending ? 'Accepting…' : 'Create account and accept'}
          </button>
        </form>
      </AuthFrame>
    );
  }

  const user = me.data;
  if (!user || user.email.toLowerCase() !== inv.email.toLowerCase()) {
    return (
      <AuthFrame title="Accept the invitation" lead={lead}>
        <div className="space-y-4 text-sm text-tide-800">
          {user ? (
            <>
              <p>You're signed in as {user.email}, but the invitation is for {inv.email}.</p>
              <button type="button" className="btn btn-quiet w-full" disabled={signOut.isPending}
                onClick={() => signOut.mutate(undefined, { onSettled: () => navigate(`/sign-in?next=${here}`) })}>
                Sign out and sign in as {inv.email}
              </button>
            </>
          ) : (
            <>
              <p>Sign in as {inv.email} to accept.</p>
              <AuthLink to={`/sign-in?next=${here}`}>Sign in</AuthLink>
            </>
          )}
        </div>
      </AuthFrame>
    );
  }

  return (
    <AuthFrame title="Accept the invitation" lead={lead}>
      <div className="space-y-4">
        {accept.isError && <Notice tone="error">{errorText(accept.error)}</Notice>}
        <button type="button" className="btn btn-primary w-full" onClick={() => accept.mutate({ token }, { onSuccess: done })} disabled={accept.isPending}>
          {accept.isPending ? 'Accepting…' : 'Accept and open the pattern'}
        </button>
      </div>
    </AuthFrame>
  );
}
