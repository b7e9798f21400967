// The "Checks" tab: why a solve failed (and what to try), then every finding, worst first.
import { useEditor, useSolveState } from '../EditorContext';
import { WarningList } from './WarningList';

export function SolveErrorBox() {
  const editor = useEditor();
  const failure = useSolveState((s) => s.failure);
  if (!failure) return null;
  const parts = failure.error.parts ?? [];
  return (
    <div role="alert" className="rounded border border-danger/60 bg-danger/10 px-3 py-2 text-[12px] leading-snug" data-testid="solve-error">
      <div className="mb-0.5 text-[11px] font-bold uppercase tracking-wider text-danger">Cannot solve</div>
      <p>{failure.error.message}</p>
      {parts.length > 0 && (
        <p className="mt-1">
          Look at{' '}
          {parts.map((id, i) => (
            <span key={id}>
              {i > 0 && ', '}
              <button type="button" className="num font-semibold text-accent hover:underline" onClick={() => editor.actions.select({ parts: [id] })}>
                {id}
              </button>
            </span>
          ))}
          {failure.error.nets?.length ? <span className="text-ink-muted"> (nets {failure.error.nets.join(', ')})</span> : null}
        </p>
      )}
    </div>
  );
}

export function ChecksPanel() {
  const warnings = useSolveState((s) => s.warnings);
  const status = useSolveState((s) => s.status);
  return (
    <div className="flex flex-col gap-3 p-4" data-testid="checks-panel">
      <SolveErrorBox />
      {warnings.length ? (
        <WarningList warnings={warnings} />
      ) : status === 'ok' ? (
        <p className="text-[13px] text-ok">No findings: every part is within its ratings.</p>
      ) : null}
      <p className="text-[11px] leading-snug text-ink-muted">
        Checks cover ratings, LED current, supplies above 60 V DC and solver problems. They are a design aid, not a safety
        certification: anything on mains or large batteries follows local electrical codes and licensed practice.
      </p>
    </div>
  );
}
