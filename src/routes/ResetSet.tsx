/** Password reset, step two: the mailed link lands here to set a new password. */
import { useState, type FormEvent } from 'react';
import { useParams } from 'react-router';
import { useSetNewPassword } from '../api/useAuth';
import { errorText } from '../api/client';
import { AuthFrame, AuthLink } from '../components/AuthFrame';
import { Field } from '../components/Field';
import { Notice } from '../components/Notice';
import { MIN_PASSWORD } from '../components/password';

export function Component() {
  const { token = '' } = useParams();
  const setPassword = useSetNewPassword();
  const [password, setPw] = useState('');
  const [repeat, setRepeat] = useState('');
  const [touched, setTouched] = useState(false);
  const mismatch = touched && repeat !== password;
  const short = touched && password.length < MIN_PASSWORD;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setTouched(true);
    if (password.length < MIN_PASSWORD || password !== repeat) return;
    setPassword.mutate({ token, password });
  };

  return (
    <AuthFrame title="Choose a new password" footer={<p><AuthLink to="/sign-in">Back to sign in</AuthLink></p>}>
      {setPassword.isSuccess ? (
        <div className="space-y-4">
          <Notice tone="success">Your password has been changed. Sign in with the new one.</Notice>
          <AuthLink to="/sign-in">Sign in</AuthLink>
        </div>
      ) : (
        <form onSubmit={submit} className="space-y-4" noValidate>
          {setPassword.isError && (
            <Notice tone="error">
              {errorText(setPassword.error)} If the link has expired, <AuthLink to="/reset-password">ask for a new one</AuthLink>.
            </Notice>
          )}
          <Field label="New password" type="password" autoComplete="new-password" required value={password}
            onChange={(e) => setPw(e.target.value)} help={`At least ${MIN_PASSWORD} characters.`}
            error={short ? `Use at least ${MIN_PASSWORD} characters.` : null} autoFocus />
          <Field label="Repeat the new password" type="password" autoComplete="new-password" required value={repeat}
            onChange={(e) => setRepeat(e.target.value)} error={mismatch ? 'The two passwords differ.' : null} />
          <button type="submit" className="btn btn-primary w-full" disabled={setPassword.isPending}>
            {setPassword.isPending ? 'Saving…' : 'Set new password'}
          </button>
        </form>
      )}
    </AuthFrame>
  );
}
