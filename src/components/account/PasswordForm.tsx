/**
 * Password card of the account page: change the password with the current
 * one (same rule as sign-up, checked here before sending and again by the
 * server), or, for a forgotten current password, have a reset link mailed.
 * After a change every other signed-in browser is signed out; this one stays,
 * and the server mails the account a notice of the change.
 */
import { useRef, useState, type FormEvent } from 'react';
import { errorText } from '../../api/client';
import type { User } from '../../api/types';
import { useChangePassword, useRequestPasswordReset } from '../../api/useAuth';
import { Field } from '../Field';
import { Notice } from '../Notice';
import { MIN_PASSWORD, passwordProblem } from '../password';
import { fieldError } from './field-errors';

export function PasswordForm({ user }: { user: User }) {
  const change = useChangePassword();
  const reset = useRequestPasswordReset();
  const [current, setCurrent] = useState('');
  const [next, setNext] = useState('');
  const [repeat, setRepeat] = useState('');
  const [touched, setTouched] = useState(false);
  const form = useRef<HTMLFormElement>(null);

  const currentError = (touched && !current ? 'Enter your current password.' : null) ?? (change.isError ? fieldError(change.error, 'currentPassword') : null);
  const nextError = (touched ? passwordProblem(next) ?? (next === current ? 'Choose a new password that differs from the current one.' : null) : null)
    ?? (change.isError ? fieldError(change.error, 'newPassword') : null);
  const repeatError = touched && repeat !== next ? 'The two new passwords differ.' : null;
  const otherError = change.isError && !fieldError(change.error, 'currentPassword') && !fieldError(change.error, 'newPassword') ? errorText(change.error) : null;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setTouched(true);
    if (!current || passwordProblem(next) || next === current || repeat !== next) return;
    change.mutate({ currentPassword: current, newPassword: next }, {
      onSuccess: () => { setCurrent(''); setNext(''); setRepeat(''); setTouched(false); },
      // The field's message is tied to it (aria-describedby), so focusing it reads the server's answer aloud.
      onError: (err) => {
        const field = fieldError(err, 'currentPassword') ? 'current-password' : fieldError(err, 'newPassword') ? 'new-password' : null;
        if (field) form.current?.querySelector<HTMLInputElement>(`input[autocomplete="${field}"]`)?.focus();
      },
    });
  };
  const edit = (set: (v: string) => void) => (v: string) => { set(v); if (change.isError || change.isSuccess) change.reset(); };

  return (
    <section aria-labelledby="acct-password" className="card mt-4 p-6">
      <h2 id="acct-password" className="text-base font-semibold">Password</h2>
      <p className="mt-1 text-sm text-tide-700">
        Changing it signs you out in every other browser and device; you stay signed in here.
      </p>
      <form ref={form} onSubmit={submit} noValidate className="mt-4 max-w-sm space-y-4">
        {/* Lets password managers tie the new password to this account. */}
        <input type="email" name="username" autoComplete="username" value={user.email} readOnly hidden />
        <Field label="Current password" type="password" autoComplete="current-password" required value={current}
          onChange={(e) => edit(setCurrent)(e.target.value)} error={currentError} />
        <Field label="New password" type="password" autoComplete="new-password" required value={next}
          onChange={(e) => edit(setNext)(e.target.value)} help={`At least ${MIN_PASSWORD} characters.`} error={nextError} />
        <Field label="Repeat the new password" type="password" autoComplete="new-password" required value={repeat}
          onChange={(e) => edit(setRepeat)(e.target.value)} error={repeatError} />
        {otherError && <Notice tone="error">{otherError}</Notice>}
        {change.isSuccess && <Notice tone="success">Password changed. Other browsers and devices have been signed out, and a notice is on its way to your e-mail address.</Notice>}
        <button type="submit" className="btn btn-primary" disabled={change.isPending}>
          {change.isPending ? 'Changing…' : 'Change password'}
        </button>
      </form>

      <div className="mt-5 border-t border-tide-100 pt-4 text-sm text-tide-700">
        {reset.isSuccess ? (
          <Notice tone="success">A link to choose a new password is on its way to {user.email}.</Notice>
        ) : (
          <p>
            Forgotten your current password?{' '}
            <button type="button" className="font-medium text-lavender-700 underline underline-offset-2 hover:text-lavender-900 disabled:opacity-60"
              disabled={reset.isPending} onClick={() => reset.mutate({ email: user.email })}>
              {reset.isPending ? 'Sending…' : `E-mail me a reset link`}
            </button>
          </p>
        )}
        {reset.isError && <Notice tone="error" className="mt-3">{errorText(reset.error)}</Notice>}
      </div>
    </section>
  );
}
