/**
 * Profile card of the account page: the display name (editable; the header
 * shows the new one as soon as it is saved), the e-mail and account roles.
 */
import { useState, type FormEvent } from 'react';
import { errorText } from '../../api/client';
import type { User } from '../../api/types';
import { useRename } from '../../api/useAuth';
import { Field } from '../Field';
import { Notice } from '../Notice';
import { fieldError } from './field-errors';

/** Longest display name the API accepts (shared/api-schemas.ts). */
const MAX_NAME = 120;

function roleLabel(role: string): string {
  if (role === 'editor' || role === 'technical-editor') return 'Technical editor';
  return role.replace(/[-_]+/g, ' ').replace(/^./, (c) => c.toUpperCase());
}

export function NameForm({ user }: { user: User }) {
  const rename = useRename();
  const [name, setName] = useState(user.name);
  const [touched, setTouched] = useState(false);
  const trimmed = name.trim();
  const localError = !touched ? null : !trimmed ? 'Enter a name.' : trimmed.length > MAX_NAME ? `Use at most ${MAX_NAME} characters.` : null;
  const serverField = rename.isError ? fieldError(rename.error, 'name') : null;
  const unchanged = trimmed === user.name;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setTouched(true);
    if (!trimmed || trimmed.length > MAX_NAME || unchanged) return;
    rename.mutate({ name: trimmed }, { onSuccess: (data) => { setName(data.user.name); setTouched(false); } });
  };

  return (
    <section aria-labelledby="acct-profile" className="card mt-6 p-6">
      <h2 id="acct-profile" className="text-base font-semibold">Profile</h2>
      <p className="mt-1 text-sm text-tide-700">Your name appears in the top bar, beside your revisions and comments, and in invitation mails.</p>
      <form onSubmit={submit} noValidate className="mt-4 flex items-start gap-3">
        <Field label="Display name" className="flex-1" autoComplete="name" required maxLength={MAX_NAME + 20} value={name}
          onChange={(e) => { setName(e.target.value); if (rename.isSuccess || rename.isError) rename.reset(); }}
          error={localError ?? serverField} />
        <button type="submit" className="btn btn-primary mt-6" disabled={rename.isPending || unchanged}>
          {rename.isPending ? 'Saving…' : 'Save name'}
        </button>
      </form>
      {rename.isError && !serverField && <Notice tone="error" className="mt-3">{errorText(rename.error)}</Notice>}
      {rename.isSuccess && <Notice tone="success" className="mt-3">Saved. You now appear as {rename.data.user.name}.</Notice>}
      <dl className="mt-5 grid grid-cols-[9rem_1fr] gap-y-3 border-t border-tide-100 pt-4 text-sm">
        <dt className="text-tide-700">E-mail</dt><dd className="font-medium">{user.email}</dd>
        <dt className="text-tide-700">Roles</dt>
        <dd className="flex flex-wrap gap-1.5">
          {user.roles.length ? user.roles.map((r) => (
            <span key={r} className="rounded-full border border-lavender-200 bg-lavender-50 px-2 py-0.5 text-caption font-medium text-lavender-800">{roleLabel(r)}</span>
          )) : <span className="text-tide-600">No account roles; access is granted per pattern.</span>}
        </dd>
      </dl>
    </section>
  );
}
