import { Link, useNavigate, useParams } from 'react-router-dom';
import { useAcceptInvitation, useInvitationInfo } from '../cloud/memberQueries';
import { cloudPaths } from '../cloud/routeIds';
import { signInHref, useMe } from '../cloud/session';
import { buttonClass, ErrorNote, Loading } from '../cloud/ui';

/** `/invitations/:token`: the accept link from the invitation e-mail. */
export function InvitationPage() {
  const { token = '' } = useParams();
  const info = useInvitationInfo(token);
  const me = useMe();
  const accept = useAcceptInvitation(token);
  const navigate = useNavigate();
  if (info.isPending || me.isPending) return <Loading what="the invitation" />;
  if (info.error || !info.data) return <div className="mx-auto max-w-xl px-6 py-12"><h1 className="text-2xl font-semibold">Invitation</h1><ErrorNote error={info.error} /></div>;
  const i = info.data;
  return (
    <div className="mx-auto max-w-xl px-6 py-12">
      <h1 className="text-2xl font-semibold">Join “{i.projectTitle}”</h1>
      <p className="mt-2">
        {i.invitedBy ? `${i.invitedBy.name ?? i.invitedBy.login} invited ` : 'You were invited '}
        {i.email} as <strong>{i.role}</strong>.
      </p>
      {i.status === 'accepted' ? <p className="mt-4 text-ink-muted">This invitation has already been used.</p> : null}
      {i.status === 'expired' ? <p className="mt-4 text-ink-muted">This invitation has expired. Ask the project owner to invite you again.</p> : null}
      {i.status === 'pending' && !me.data ? (
        <a className={`${buttonClass} mt-4 inline-block`} href={signInHref(`/invitations/${token}`)}>Sign in to accept</a>
      ) : null}
      {i.status === 'pending' && me.data ? (
        <button type="button" className={`${buttonClass} mt-4`} disabled={accept.isPending}
          onClick={() => accept.mutate(undefined, { onSuccess: (r) => navigate(cloudPaths.project(r.projectId)) })}>
          Accept as {me.data.name ?? me.data.login}
        </button>
      ) : null}
      <ErrorNote error={accept.error} title="Not accepted" />
      <p className="mt-6"><Link className="text-accent underline" to="/projects">Your projects</Link></p>
    </div>
  );
}
