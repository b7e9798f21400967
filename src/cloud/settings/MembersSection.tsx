import { useNavigate } from 'react-router-dom';
import { useMembers, useRemoveMember, useSetMemberRole } from '../memberQueries';
import { ROLES, roleAtLeast, type Me, type ProjectDetail, type Role } from '../types';
import { ErrorNote, inputClass, Loading, quietButtonClass, RoleBadge, Section, When } from '../ui';

export function MembersSection({ project, me }: { project: ProjectDetail; me: Me }) {
  const members = useMembers(project.id);
  const setRole = useSetMemberRole(project.id);
  const remove = useRemoveMember(project.id);
  const navigate = useNavigate();
  const owner = roleAtLeast(project.role, 'owner');
  return (
    <Section title="Members" id="members">
      {members.isPending ? <Loading what="members" /> : null}
      <ErrorNote error={members.error} />
      <ul className="divide-y divide-rule">
        {members.data?.map((m) => {
          const self = m.userId === me.id;
          return (
            <li key={m.userId} className="flex items-center gap-3 py-2 text-sm" data-member={m.login}>
              {m.avatarUrl ? <img src={m.avatarUrl} alt="" className="h-6 w-6 rounded-full" /> : null}
              <span className="min-w-40">{m.name ?? m.login} <span className="text-ink-muted">@{m.login}{self ? ' (you)' : ''}</span></span>
              <span className="text-ink-muted">joined <When iso={m.joinedAt} /></span>
              <span className="ml-auto flex items-center gap-2">
                {owner ? (
                  <select className={inputClass} aria-label={`Role of ${m.login}`} value={m.role} disabled={setRole.isPending}
                    onChange={(e) => setRole.mutate({ userId: m.userId, role: e.target.value as Role })}>
                    {ROLES.map((r) => <option key={r} value={r}>{r}</option>)}
                  </select>
                ) : <RoleBadge role={m.role} />}
                {owner || self ? (
                  <button type="button" className={quietButtonClass} disabled={remove.isPending}
                    onClick={() => {
                      if (!window.confirm(self ? `Leave “${project.title}”? You will lose access until someone invites you again.` : `Remove ${m.login} from this project?`)) return;
                      remove.mutate(m.userId, { onSuccess: () => { if (self) navigate('/projects'); } });
                    }}>
                    {self ? 'Leave' : 'Remove'}
                  </button>
                ) : null}
              </span>
            </li>
          );
        })}
      </ul>
      <ErrorNote error={setRole.error} title="Role not changed" />
      <ErrorNote error={remove.error} title="Not removed" />
    </Section>
  );
}
