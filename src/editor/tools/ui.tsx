// Small building blocks shared by the tool panels: labelled fields, buttons, the run status line
// with its progress bar and cancel button.
import type { ButtonHTMLAttributes, ReactNode } from 'react';
import type { RunState } from './runner/runState';

export function Field({ label, children, hint, className = '' }: { label: string; children: ReactNode; hint?: string; className?: string }) {
  return (
    <label className={`flex min-w-0 flex-col gap-0.5 text-xs ${className}`}>
      <span className="text-ink-muted">{label}</span>
      {children}
      {hint && <span className="text-[11px] text-ink-muted">{hint}</span>}
    </label>
  );
}

export const inputClass =
  'h-7 min-w-0 rounded border border-rule bg-panel px-1.5 text-sm text-ink focus:border-accent focus:outline-none disabled:opacity-60';

export function Button({ variant = 'plain', className = '', ...rest }: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: 'primary' | 'plain' | 'danger' }) {
  const look =
    variant === 'primary'
      ? 'bg-accent text-accent-ink border-accent hover:opacity-90'
      : variant === 'danger'
        ? 'border-danger text-danger hover:bg-sunken'
        : 'border-rule text-ink hover:bg-sunken';
  return <button type="button" className={`h-7 rounded border px-2.5 text-sm font-medium disabled:cursor-not-allowed disabled:opacity-50 ${look} ${className}`} {...rest} />;
}

export function Section({ title, children, actions, plainTitle }: { title: string; children: ReactNode; actions?: ReactNode; plainTitle?: boolean }) {
  return (
    <section className="border-b border-rule px-3 py-2.5">
      <div className="mb-1.5 flex items-center gap-2">
        <h3 className={plainTitle ? 'num text-sm font-semibold text-ink' : 'text-xs font-semibold uppercase tracking-wide text-ink-muted'}>{title}</h3>
        <div className="ml-auto flex items-center gap-1.5">{actions}</div>
      </div>
      {children}
    </section>
  );
}

/** Progress, cancel, and what became of the last run. */
export function RunStatus<T>({ run, stale, onCancel, label, testId }: { run: RunState<T>; stale: boolean; onCancel: () => void; label: string; testId: string }) {
  if (run.status === 'running')
    return (
      <div className="mt-2 flex items-center gap-2" data-testid={`${testId}-running`}>
        <div
          className="h-2 flex-1 overflow-hidden rounded bg-sunken"
          role="progressbar"
          aria-label={`${label} progress`}
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={run.progress === null ? undefined : Math.round(run.progress * 100)}
        >
          <div className="h-full bg-accent transition-[width] duration-150" style={{ width: `${Math.round((run.progress ?? 0) * 100)}%` }} />
        </div>
        <span className="num w-10 text-right text-xs text-ink-muted">{run.progress === null ? '…' : `${Math.round(run.progress * 100)} %`}</span>
        <Button variant="danger" onClick={onCancel} data-testid={`${testId}-cancel`}>
          Cancel
        </Button>
      </div>
    );
  const note =
    run.status === 'cancelled'
      ? `${label} cancelled.${run.result ? ' Showing the previous result.' : ''}`
      : run.status === 'failed'
        ? `${label} failed: ${run.error}${run.result ? ' Showing the previous result.' : ''}`
        : run.result && stale
          ? 'The sheet has changed since this result: run again to update it.'
          : null;
  if (!note) return null;
  return (
    <p
      className={`mt-2 rounded px-2 py-1 text-xs ${run.status === 'failed' ? 'bg-sunken text-danger' : 'bg-sunken text-ink-muted'}`}
      role={run.status === 'failed' ? 'alert' : 'status'}
      data-testid={`${testId}-note`}
    >
      {note}
    </p>
  );
}
