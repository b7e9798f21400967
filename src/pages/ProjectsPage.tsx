import { NewProjectForm } from '../cloud/NewProjectForm';
import { ProjectsTable } from '../cloud/ProjectsTable';
import { useProjects } from '../cloud/projectQueries';
import { ErrorNote, Loading, RequireSignIn } from '../cloud/ui';

function ProjectsList() {
  const projects = useProjects();
  return (
    <>
      {projects.isPending ? <Loading what="your projects" /> : null}
      <ErrorNote error={projects.error} title="Projects could not be loaded" />
      {projects.data ? <ProjectsTable projects={projects.data} /> : null}
    </>
  );
}

/** `/projects`: the signed-in person's cloud projects. */
export function ProjectsPage() {
  return (
    <RequireSignIn>
      {() => (
        <div className="mx-auto max-w-5xl px-6 py-8">
          <h1 className="text-2xl font-semibold">Projects</h1>
          <div className="mt-4"><NewProjectForm /></div>
          <ProjectsList />
        </div>
      )}
    </RequireSignIn>
  );
}
