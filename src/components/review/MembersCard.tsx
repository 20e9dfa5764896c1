/**
 * Who works on the pattern: members with their roles and, for the owner,
 * an invitation form (editor, test knitter or knitter; the invited person
 * gets a mail with a link) and the invitations still open.
 */
import { useState, type FormEvent } from 'react';
import type { MemberRoleName } from '../../../shared/api-schemas';
import { errorText } from '../../api/client';
import { useInvite, useMembers } from '../../api/useReview';
import { Notice } from '../Notice';

// Listed here rather than imported: the schema module would bring zod into the page.
const MEMBER_ROLES: MemberRoleName[] = ['editor', 'test-knitter', 'knitter'];
const roleWords: Record<string, string> = { owner: 'designer', editor: 'technical editor', 'test-knitter': 'test knitter', knitter: 'knitter' };

export function MembersCard({ patternId, isOwner }: { patternId: string; isOwner: boolean }) {
  const members = useMembers(patternId);
  const invite = useInvite(patternId);
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<MemberRoleName>('editor');
  const submit = (e: FormEvent) => {
    e.preventDefault();
    invite.mutate({ email: email.trim(), role }, { onSuccess: () => setEmail('') });
  };
  const open = (members.data?.invitations ?? []).filter((i) => !i.acceptedAt && Date.parse(i.expiresAt) > Date.now());
  return (
    <section aria-labelledby="members-h" className="card p-4">
      <h2 id="members-h" className="text-sm font-semibold text-tide-900">People on this pattern</h2>
      {members.isPending ? <p role="status" className="mt-2 text-sm text-tide-600">Loading people…</p>
        : members.isError ? <Notice tone="error" className="mt-2">{errorText(members.error)}</Notice>
          : (
            <ul className="mt-2 space-y-1 text-sm">
              {members.data.members.map((m) => (
                <li key={m.user.id}><span className="font-medium">{m.user.name}</span> <span className="text-tide-600">· {roleWords[m.role] ?? m.role}</span></li>
              ))}
              {open.map((i) => (
                <li key={i.id} className="text-tide-600">{i.email} · {roleWords[i.role]} (invited, not yet accepted)</li>
              ))}
            </ul>
          )}
      {isOwner && (
        <form onSubmit={submit} className="mt-3 grid grid-cols-[1fr_auto] items-end gap-2">
          <div className="col-span-2">
            <label htmlFor="inv-email" className="field-label">Invite by e-mail</label>
            <input id="inv-email" type="email" required className="field-input" value={email} onChange={(e) => setEmail(e.target.value)} autoComplete="off" />
          </div>
          <div>
            <label htmlFor="inv-role" className="field-label">As</label>
            <select id="inv-role" className="field-input" value={role} onChange={(e) => setRole(e.target.value as MemberRoleName)}>
              {MEMBER_ROLES.map((r) => <option key={r} value={r}>{roleWords[r]}</option>)}
            </select>
          </div>
          <button type="submit" className="btn btn-quiet" disabled={invite.isPending || !email.trim()}>Invite</button>
          {invite.isError && <Notice tone="error" className="col-span-2">{errorText(invite.error)}</Notice>}
          {invite.isSuccess && <Notice tone="success" className="col-span-2">{invite.data.delivered ? 'Invitation sent.' : 'Invitation made, but the mail could not be sent.'}</Notice>}
        </form>
      )}
    </section>
  );
}
