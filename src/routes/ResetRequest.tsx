/** Password reset, step one: ask for a link by e-mail. */
import { useState, type FormEvent } from 'react';
import { useRequestPasswordReset } from '../api/useAuth';
import { errorText } from '../api/client';
import { AuthFrame, AuthLink } from '../components/AuthFrame';
import { Field } from '../components/Field';
import { Notice } from '../components/Notice';

export function Component() {
  const request = useRequestPasswordReset();
  const [email, setEmail] = useState('');
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (email.trim()) request.mutate({ email: email.trim() });
  };
  return (
    <AuthFrame
      title="Reset your password"
      lead="We'll e-mail you a link to choose a new password. The link works once and expires after a while."
      footer={<p>Remembered it? <AuthLink to="/sign-in">Back to sign in</AuthLink></p>}
    >
      {request.isSuccess ? (
        <Notice tone="success">
          If an account uses <strong>{email.trim()}</strong>, a reset link is on its way. Check your inbox (and spam folder).
        </Notice>
      ) : (
        <form onSubmit={submit} className="space-y-4" noValidate>
          {request.isError && <Notice tone="error">{errorText(request.error)}</Notice>}
          <Field label="E-mail" type="email" name="email" autoComplete="email" required value={email} onChange={(e) => setEmail(e.target.value)} autoFocus />
          <button type="submit" className="btn btn-primary w-full" disabled={request.isPending || !email.trim()}>
            {request.isPending ? 'Sending…' : 'Send reset link'}
          </button>
        </form>
      )}
    </AuthFrame>
  );
}
