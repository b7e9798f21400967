import { Link, useParams } from 'react-router-dom';
import { useProject } from '../cloud/projectQueries';
import { cloudPaths } from '../cloud/routeIds';
import { DangerSection } from '../cloud/settings/DangerSection';
import { GeneralSection } from '../cloud/settings/GeneralSection';
import { InvitationsSection } from '../cloud/settings/InvitationsSection';
import { MembersSection } from '../cloud/settings/MembersSection';
import { RevisionsSection } from '../cloud/settings/RevisionsSection';
import { ShareSection } from '../cloud/settings/ShareSection';
import { roleAtLeast, type Me } from '../cloud/types';
import { ErrorNote, Loading, RequireSignIn } from '../cloud/ui';

function Settings({ id, me }: { id: string; me: Me }) {
  const project = useProject(id);
  if (project.isPending) return <Loading what="the project" />;
  if (project.error || !project.data) return <div className="mx-auto max-w-3xl px-6 py-8"><ErrorNote error={project.error} /><Link className="text-accent underline" to="/projects">All projects</Link></div>;
  const p = project.data;
  const owner = roleAtLeast(p.role, 'owner');
  return (
    <div className="mx-auto max-w-3xl space-y-4 px-6 py-8">
      <p className="text-sm"><Link className="text-accent hover:underline" to="/projects">Projects</Link> / <Link className="text-accent hover:underline" to={cloudPaths.project(p.id)}>{p.title}</Link></p>
      <h1 className="text-2xl font-semibold">{p.title}: settings</h1>
      <GeneralSection key={p.title} project={p} />
      <MembersSection project={p} me={me} />
      {owner ? <InvitationsSection project={p} /> : null}
      <RevisionsSection project={p} />
      {owner ? <ShareSection key={String(p.share?.enabled)} project={p} /> : null}
      {owner ? <DangerSection project={p} /> : null}
    </div>
  );
}

/** `/projects/:id/settings`: members, invitations, roles, revisions, share link, delete. */
export function ProjectSettingsPage() {
  const { id = '' } = useParams();
  return <RequireSignIn>{(me) => <Settings id={id} me={me} />}</RequireSignIn>;
}
