// The state of one kind of run (a sweep, a Monte Carlo): what is running, how far it is, and the
// last good result, which a cancelled or failed run leaves in place.
import { JobCancelled, JobFailed } from './jobTypes';

export type RunStatus = 'idle' | 'running' | 'done' | 'failed' | 'cancelled';

export interface RunState<T> {
  status: RunStatus;
  /** 0..1 while running, null when the run gives no progress */
  progress: number | null;
  /** the last run that finished, kept through later failures and cancels */
  result: T | null;
  /** the electrical key of the sheet that result was computed from (to flag a stale result) */
  resultKey: string | null;
  /** what went wrong in the latest run */
  error: string | null;
  errorParts: string[];
}

export const idleRun = <T>(): RunState<T> => ({ status: 'idle', progress: null, result: null, resultKey: null, error: null, errorParts: [] });

export interface RunHandle {
  cancel(): void;
}

/**
 * Start `job` and report into `set`. A new start while a run is going cancels the old one first
 * (the caller does that through the handle it kept).
 */
export function startRun<T>(
  set: (update: (prev: RunState<T>) => RunState<T>) => void,
  job: (signal: AbortSignal, onProgress: (done: number, total: number) => void) => Promise<T>,
  sheetKey: string,
): RunHandle {
  const ctl = new AbortController();
  set((prev) => ({ ...prev, status: 'running', progress: 0, error: null, errorParts: [] }));
  job(ctl.signal, (done, total) => {
    if (ctl.signal.aborted) return;
    set((prev) => (prev.status === 'running' ? { ...prev, progress: total > 0 ? done / total : null } : prev));
  }).then(
    (result) => {
      if (ctl.signal.aborted) return;
      set(() => ({ status: 'done', progress: null, result, resultKey: sheetKey, error: null, errorParts: [] }));
    },
    (e: unknown) => {
      if (e instanceof JobCancelled || ctl.signal.aborted) {
        set((prev) => ({ ...prev, status: 'cancelled', progress: null }));
        return;
      }
      const message = e instanceof Error ? e.message : String(e);
      const parts = e instanceof JobFailed ? e.parts : [];
      set((prev) => ({ ...prev, status: 'failed', progress: null, error: message, errorParts: parts }));
    },
  );
  return {
    cancel() {
      if (ctl.signal.aborted) return;
      ctl.abort();
      set((prev) => (prev.status === 'running' ? { ...prev, status: 'cancelled', progress: null } : prev));
    },
  };
}
