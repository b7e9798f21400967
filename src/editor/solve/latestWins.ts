// Keeps the solver busy with only the newest sheet: while one solve runs, later requests replace
// each other, and a result that is no longer the newest is dropped. If a solve takes far too long
// while edits are waiting, the worker is thrown away and a fresh one takes the newest sheet, so a
// pathological circuit can never leave the readings stuck behind the drawing. An inline solver
// (inlineSolver.ts), when given, answers small sheets at once on the calling thread.
import type { Sheet } from '../../../shared/sheet';
import type { InlineSolver } from './inlineSolver';
import type { SolveResult } from './resultTypes';

export interface SolverPort {
  solve(sheet: Sheet): Promise<SolveResult>;
  /** the same, with the solve's own time in the worker, ms (the round trip says little about the sheet) */
  solveTimed?(sheet: Sheet): Promise<{ result: SolveResult; ms: number }>;
}

export interface SolverHandle {
  port: SolverPort;
  dispose(): void;
}

export interface SolveOutcome {
  /** sequence number of the request this answers (the newest at the time it arrives) */
  seq: number;
  /** the sheet that was solved */
  sheet: Sheet;
  result: SolveResult;
  /** time of the solve, ms (the worker's own when its port reports it, else request to answer) */
  ms: number;
  /** where it was solved: on the calling thread (inline) or in the worker */
  where: 'inline' | 'worker';
}

export interface LatestWinsOptions {
  /** a solve older than this is abandoned when a newer request is waiting, ms (default 3000) */
  stallMs?: number;
  now?: () => number;
  onResult(outcome: SolveOutcome): void;
  onBusy?(busy: boolean): void;
  /** solves small sheets synchronously inside request(); the worker takes what it declines */
  inline?: InlineSolver;
}

export class LatestWinsSolver {
  private handle: SolverHandle;
  private latest = 0;
  private pending: { seq: number; sheet: Sheet } | null = null;
  private inFlight: { seq: number; started: number; generation: number } | null = null;
  private generation = 0;
  private disposed = false;
  private readonly stallMs: number;
  private readonly now: () => number;
  private inline: InlineSolver | null;

  constructor(
    private readonly makeHandle: () => SolverHandle,
    private readonly options: LatestWinsOptions,
  ) {
    this.handle = makeHandle();
    this.stallMs = options.stallMs ?? 3000;
    this.now = options.now ?? (() => performance.now());
    this.inline = options.inline ?? null;
  }

  /** Use `inline` for the sheets it accepts from now on (null: the worker for everything). */
  setInline(inline: InlineSolver | null): void {
    this.inline = inline;
  }

  /**
   * Ask for a solve of `sheet`; returns its sequence number. An inline solve delivers its result
   * before this returns; a worker solve still running then is stale and its answer is dropped.
   */
  request(sheet: Sheet): number {
    const seq = ++this.latest;
    const now = this.inline?.trySolve(sheet);
    if (now) {
      this.pending = null;
      this.options.onResult({ seq, sheet, result: now.result, ms: now.ms, where: 'inline' });
      return seq;
    }
    this.pending = { seq, sheet };
    if (!this.inFlight) this.runPending();
    else if (this.now() - this.inFlight.started > this.stallMs) this.restart();
    return seq;
  }

  dispose(): void {
    this.disposed = true;
    this.pending = null;
    this.handle.dispose();
  }

  private restart(): void {
    this.handle.dispose();
    this.handle = this.makeHandle();
    this.generation++;
    this.inFlight = null;
    this.runPending();
  }

  private runPending(): void {
    const job = this.pending;
    if (!job || this.disposed) {
      this.options.onBusy?.(false);
      return;
    }
    this.pending = null;
    const started = this.now();
    const generation = this.generation;
    this.inFlight = { seq: job.seq, started, generation };
    this.options.onBusy?.(true);
    const settle = (result: SolveResult, ms = this.now() - started) => {
      if (this.disposed || generation !== this.generation) return; // from a worker we abandoned
      this.inFlight = null;
      if (job.seq === this.latest) this.options.onResult({ seq: job.seq, sheet: job.sheet, result, ms, where: 'worker' });
      this.runPending();
    };
    const port = this.handle.port;
    const answer = port.solveTimed ? port.solveTimed(job.sheet) : port.solve(job.sheet).then((result) => ({ result, ms: this.now() - started }));
    answer.then(({ result, ms }) => settle(result, ms), (e: unknown) =>
      settle({
        ok: false,
        error: {
          code: 'solver_crashed',
          message: `The solver stopped with an internal error (${e instanceof Error ? e.message : String(e)}). Undo the last change or reload the page; if it happens again, please report the sheet.`,
        },
      }),
    );
  }
}
