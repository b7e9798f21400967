// What crosses the worker boundary: an outcome instead of a thrown error (a thrown error loses its
// fields on the way), and progress as (done, total) points.

export type JobOutcome<T> =
  | { ok: true; value: T }
  /** message says what is wrong and what to try; parts/nets point at the places concerned */
  | { ok: false; message: string; parts?: string[]; nets?: string[] };

export type ProgressFn = (done: number, total: number) => void;

/** Raised (rejected) when a run was cancelled; the panels keep their last good result. */
export class JobCancelled extends Error {
  constructor() {
    super('The run was cancelled.');
    this.name = 'JobCancelled';
  }
}

/** Raised when the analysis itself reported a problem (bad input, circuit that does not solve). */
export class JobFailed extends Error {
  constructor(
    message: string,
    readonly parts: string[] = [],
    readonly nets: string[] = [],
  ) {
    super(message);
    this.name = 'JobFailed';
  }
}

/** The value of an outcome, or a JobFailed. */
export function unwrap<T>(o: JobOutcome<T>): T {
  if (o.ok) return o.value;
  throw new JobFailed(o.message, o.parts, o.nets);
}
