import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { endpoints } from '../endpoints';
import { useRenameProject } from '../projectQueries';
import { cloudPaths } from '../routeIds';
import { roleAtLeast, type ProjectDetail } from '../types';
import { buttonClass, ErrorNote, inputClass, quietButtonClass, RoleBadge, Section, When } from '../ui';

export function GeneralSection({ project }: { project: ProjectDetail }) {
  const [title, setTitle] = useState(project.title);
  const rename = useRenameProject(project.id);
  const owner = roleAtLeast(project.role, 'owner');
  const submit = (e: FormEvent) => {
    e.preventDefault();
    rename.mutate({ title, baseVersion: project.version });
  };
  return (
    <Section title="Project" id="general">
      <p className="text-sm">
        Your role: <RoleBadge role={project.role} /> · version <span className="num">{project.version}</span> · changed <When iso={project.updatedAt} />
        {project.updatedBy ? ` by ${project.updatedBy.name ?? project.updatedBy.login}` : ''}
      </p>
      <div className="mt-3 flex gap-2">
        <Link className={buttonClass} to={cloudPaths.project(project.id)}>Open in the editor</Link>
        <a className={quietButtonClass} href={endpoints.exportUrl(project.id)} download>Export sheet file</a>
      </div>
      {owner ? (
        <form onSubmit={submit} className="mt-4 flex items-end gap-2">
          <label className="flex flex-col text-sm">
            Title
            <input className={inputClass} value={title} maxLength={120} onChange={(e) => setTitle(e.target.value)} aria-label="Project title" />
          </label>
          <button type="submit" className={quietButtonClass} disabled={rename.isPending || title.trim() === project.title}>Rename</button>
        </form>
      ) : <p className="mt-3 text-sm text-ink-muted">Only owners rename, share or delete a project.</p>}
      <ErrorNote error={rename.error} title="Not renamed" />
    </Section>
  );
}
