/** Sign-up page: name, e-mail and password create an account and a session. */
import { useState, type FormEvent } from 'react';
import { Navigate, useNavigate, useSearchParams } from 'react-router';
import { useMe, useSignUp } from '../api/useAuth';
import { errorText } from '../api/client';
import { AuthFrame, AuthLink } from '../components/AuthFrame';
import { Field } from '../components/Field';
import { Notice } from '../components/Notice';
import { MIN_PASSWORD } from '../components/password';
import { safeNext } from './SignIn';

export function Component() {
  const [params] = useSearchParams();
  const next = safeNext(params.get('next'));
  const me = useMe();
  const signUp = useSignUp();
  const navigate = useNavigate();
  const [name, setName] = useState('');
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [touched, setTouched] = useState(false);

  if (me.data && !signUp.isSuccess) return <Navigate to={next} replace />;
  const shortPassword = password.length > 0 && password.length < MIN_PASSWORD;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setTouched(true);
    if (!name.trim() || !email.trim() || password.length < MIN_PASSWORD) return;
    signUp.mutate({ name: name.trim(), email: email.trim(), password }, { onSuccess: () => navigate(next, { replace: true }) });
  };

  return (
    <AuthFrame
      title="Create your account"
      lead="One account for designing, reviewing and knitting patterns."
      footer={<p>Already have an account? <AuthLink to={`/sign-in${params.size ? `?${params}` : ''}`}>Sign in</AuthLink></p>}
    >
      <form onSubmit={submit} className="space-y-4" noValidate>
        {signUp.isError && <Notice tone="error">{errorText(signUp.error)}</Notice>}
        <Field label="Your name" name="name" autoComplete="name" required value={name} onChange={(e) => setName(e.target.value)}
          error={touched && !name.trim() ? 'Enter the name other people will see on your revisions.' : null} autoFocus />
        <Field label="E-mail" type="email" name="email" autoComplete="email" required value={email} onChange={(e) => setEmail(e.target.value)}
          error={touched && !email.trim() ? 'Enter your e-mail address.' : null} />
        <Field label="Password" type="password" name="new-password" autoComplete="new-password" required value={password}
          onChange={(e) => setPassword(e.target.value)} help={`At least ${MIN_PASSWORD} characters.`}
          error={(touched || shortPassword) && password.length < MIN_PASSWORD ? `Use at least ${MIN_PASSWORD} characters.` : null} />
        <button type="submit" className="btn btn-primary w-full" disabled={signUp.isPending}>
          {signUp.isPending ? 'Creating your account…' : 'Create account'}
        </button>
      </form>
    </AuthFrame>
  );
}
