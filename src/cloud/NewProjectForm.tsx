// Create a project (empty, or from an example sheet) or import a sheet file.
import { useRef, useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { exampleSheets } from './exampleSheets';
import { useCreateProject, useImportProject } from './projectQueries';
import { cloudPaths } from './routeIds';
import { buttonClass, ErrorNote, inputClass, quietButtonClass } from './ui';

export function NewProjectForm() {
  const [title, setTitle] = useState('');
  const [start, setStart] = useState('');
  const create = useCreateProject();
  const upload = useImportProject();
  const fileInput = useRef<HTMLInputElement>(null);
  const navigate = useNavigate();

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const example = exampleSheets.find((x) => x.name === start);
    const t = title.trim() || example?.title || 'Untitled sheet';
    create.mutate({ title: t, ...(example ? { sheet: example.sheet } : {}) }, { onSuccess: (p) => navigate(cloudPaths.project(p.id)) });
  };
  const onFile = (file: File | undefined) => {
    if (file) upload.mutate({ file }, { onSuccess: (p) => navigate(cloudPaths.project(p.id)) });
  };

  return (
    <form onSubmit={submit} className="flex flex-wrap items-end gap-3 rounded border border-rule bg-panel p-4" aria-label="New project">
      <label className="flex flex-col text-sm">
        Title
        <input className={inputClass} name="title" value={title} maxLength={120} onChange={(e) => setTitle(e.target.value)} placeholder="e.g. Tank level sensor tap" />
      </label>
      <label className="flex flex-col text-sm">
        Start from
        <select className={inputClass} name="start" value={start} onChange={(e) => setStart(e.target.value)}>
          <option value="">An empty sheet</option>
          {exampleSheets.map((x) => <option key={x.name} value={x.name}>Example: {x.title}</option>)}
        </select>
      </label>
      <button type="submit" className={buttonClass} disabled={create.isPending}>Create project</button>
      <span className="text-sm text-ink-muted">or</span>
      <button type="button" className={quietButtonClass} disabled={upload.isPending} onClick={() => fileInput.current?.click()}>Import a sheet file…</button>
      <input ref={fileInput} type="file" accept=".json,application/json" className="hidden" aria-label="Sheet file to import" onChange={(e) => { onFile(e.target.files?.[0]); e.target.value = ''; }} />
      <div className="basis-full">
        <ErrorNote error={create.error} title="Not created" />
        <ErrorNote error={upload.error} title="Not imported" />
      </div>
    </form>
  );
}
