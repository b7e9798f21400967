import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { useDeleteProject } from '../projectQueries';
import type { ProjectDetail } from '../types';
import { ErrorNote, inputClass, Section } from '../ui';

/** Delete, confirmed by typing the project's title. */
export function DangerSection({ project }: { project: ProjectDetail }) {
  const [typed, setTyped] = useState('');
  const del = useDeleteProject(project.id);
  const navigate = useNavigate();
  return (
    <Section title="Delete project" id="delete">
      <p className="text-sm text-ink-muted">Deleting removes the sheet, its revisions, members and invitations for everyone. It cannot be undone; export the sheet first if you may need it.</p>
      <label className="mt-3 flex flex-col text-sm">
        Type the title to confirm: <strong className="font-mono">{project.title}</strong>
        <input className={inputClass} value={typed} onChange={(e) => setTyped(e.target.value)} aria-label="Type the project title to confirm deletion" />
      </label>
      <button type="button" className="mt-2 rounded bg-danger px-3 py-1.5 text-sm font-medium text-white disabled:opacity-40"
        disabled={typed !== project.title || del.isPending}
        onClick={() => del.mutate(undefined, { onSuccess: () => navigate('/projects') })}>
        Delete this project
      </button>
      <ErrorNote error={del.error} title="Not deleted" />
    </Section>
  );
}
