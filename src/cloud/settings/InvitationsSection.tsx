import { useState, type FormEvent } from 'react';
import { useInvitations, useInvite, useRevokeInvitation } from '../memberQueries';
import type { ProjectDetail, Role } from '../types';
import { buttonClass, ErrorNote, inputClass, quietButtonClass, Section, When } from '../ui';

export function InvitationsSection({ project }: { project: ProjectDetail }) {
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<Role>('editor');
  const list = useInvitations(project.id, true);
  const invite = useInvite(project.id);
  const revoke = useRevokeInvitation(project.id);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    invite.mutate({ email, role }, { onSuccess: () => setEmail('') });
  };
  return (
    <Section title="Invitations" id="invitations">
      <form onSubmit={submit} className="flex flex-wrap items-end gap-2" aria-label="Invite by e-mail">
        <label className="flex flex-col text-sm">E-mail
          <input className={inputClass} type="email" required value={email} onChange={(e) => setEmail(e.target.value)} placeholder="colleague@example.org" />
        </label>
        <label className="flex flex-col text-sm">Role
          <select className={inputClass} value={role} onChange={(e) => setRole(e.target.value as Role)}>
            <option value="viewer">viewer: reads and solves</option>
            <option value="editor">editor: also changes the sheet</option>
            <option value="owner">owner: also manages the project</option>
          </select>
        </label>
        <button type="submit" className={buttonClass} disabled={invite.isPending}>Send invitation</button>
      </form>
      {invite.isSuccess ? <p className="mt-2 text-sm text-ok" role="status">Invitation sent. The link works once and expires.</p> : null}
      <ErrorNote error={invite.error} title="Not sent" />
      <ErrorNote error={list.error} />
      {list.data && list.data.length > 0 ? (
        <ul className="mt-3 divide-y divide-rule text-sm">
          {list.data.map((i) => (
            <li key={i.id} className="flex items-center gap-3 py-2">
              <span>{i.email}</span><span className="text-ink-muted">as {i.role}</span>
              <span className="text-ink-muted">{Date.parse(i.expiresAt) < Date.now() ? 'expired' : <>expires <When iso={i.expiresAt} /></>}</span>
              <button type="button" className={`${quietButtonClass} ml-auto`} onClick={() => revoke.mutate(i.id)}>Revoke</button>
            </li>
          ))}
        </ul>
      ) : <p className="mt-3 text-sm text-ink-muted">No pending invitations.</p>}
      <ErrorNote error={revoke.error} title="Not revoked" />
    </Section>
  );
}
