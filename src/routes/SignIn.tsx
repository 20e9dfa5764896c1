/** Sign-in page: e-mail and password, then back to where the person was going. */
import { useState, type FormEvent } from 'react';
import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { useMe, useSignIn } from '../api/useAuth';
import { errorText } from '../api/client';
import { AuthFrame, AuthLink } from '../components/AuthFrame';
import { Field } from '../components/Field';
import { Notice } from '../components/Notice';

/** Only same-site paths are followed after sign-in (never another origin). */
export function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : '/patterns';
}

export function Component() {
  const [params] = useSearchParams();
  const next = safeNext(params.get('next'));
  const me = useMe();
  const signIn = useSignIn();
  const navigate = useNavigate();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');

  if (me.data && !signIn.isSuccess) return <Navigate to={next} replace />;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    signIn.mutate({ email: email.trim(), password }, { onSuccess: () => navigate(next, { replace: true }) });
  };

  return (
    <AuthFrame
      title="Sign in to Loopwright"
      lead="Write patterns as text; every round, size and float is checked as you type."
      footer={
        <>
          <p>New here? <AuthLink to="/sign-up">Create an account</AuthLink></p>
          <p><AuthLink to="/reset-password">Forgotten your password?</AuthLink></p>
        </>
      }
    >
      <form onSubmit={submit} className="space-y-4" noValidate>
        {signIn.isError && <Notice tone="error">{errorText(signIn.error)}</Notice>}
        <Field label="E-mail" type="email" name="email" autoComplete="username" required value={email} onChange={(e) => setEmail(e.target.value)} autoFocus />
        <Field label="Password" type="password" name="password" autoComplete="current-password" required value={password} onChange={(e) => setPassword(e.target.value)} />
        <button type="submit" className="btn btn-primary w-full" disabled={signIn.isPending || !email || !password}>
          {signIn.isPending ? 'Signing in…' : 'Sign in'}
        </button>
      </form>
    </AuthFrame>
  );
}
