import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { useRestoreRevision, useRevisions, useSaveRevision } from '../revisionQueries';
import { cloudPaths } from '../routeIds';
import { roleAtLeast, type ProjectDetail } from '../types';
import { buttonClass, ErrorNote, inputClass, Loading, quietButtonClass, Section, When } from '../ui';

const KIND: Record<string, string> = { named: '', restore: 'restore', auto: 'automatic' };

export function RevisionsSection({ project }: { project: ProjectDetail }) {
  const [label, setLabel] = useState('');
  const revisions = useRevisions(project.id);
  const save = useSaveRevision(project.id);
  const restore = useRestoreRevision(project.id);
  const editor = roleAtLeast(project.role, 'editor');
  const submit = (e: FormEvent) => {
    e.preventDefault();
    save.mutate(label, { onSuccess: () => setLabel('') });
  };
  return (
    <Section title="Revisions" id="revisions">
      {editor ? (
        <form onSubmit={submit} className="flex items-end gap-2" aria-label="Save a revision">
          <label className="flex flex-col text-sm">Name of this state
            <input className={inputClass} required maxLength={120} value={label} onChange={(e) => setLabel(e.target.value)} placeholder="e.g. Sent for review" />
          </label>
          <button type="submit" className={buttonClass} disabled={save.isPending}>Save revision</button>
        </form>
      ) : null}
      <ErrorNote error={save.error} title="Not saved" />
      {revisions.isPending ? <Loading what="revisions" /> : null}
      <ErrorNote error={revisions.error} />
      <ul className="mt-3 divide-y divide-rule text-sm">
        {revisions.data?.map((r) => (
          <li key={r.id} className="flex items-center gap-3 py-2" data-revision={r.label}>
            <span className="font-medium">{r.label}</span>
            {KIND[r.kind] ? <span className="rounded bg-sunken px-1 text-xs">{KIND[r.kind]}</span> : null}
            <span className="text-ink-muted">v<span className="num">{r.projectVersion}</span> · <When iso={r.createdAt} />{r.createdBy ? ` · ${r.createdBy.name ?? r.createdBy.login}` : ''}</span>
            <span className="ml-auto flex gap-2">
              <Link className={quietButtonClass} to={cloudPaths.revision(project.id, r.id)}>View</Link>
              {editor ? (
                <button type="button" className={quietButtonClass} disabled={restore.isPending}
                  onClick={() => { if (window.confirm(`Restore “${r.label}”? The current sheet is kept as a revision first.`)) restore.mutate({ revId: r.id, baseVersion: project.version }); }}>
                  Restore
                </button>
              ) : null}
            </span>
          </li>
        ))}
      </ul>
      {revisions.data?.length === 0 ? <p className="text-sm text-ink-muted">No revisions yet.</p> : null}
      <ErrorNote error={restore.error} title="Not restored" />
    </Section>
  );
}
