// Small sheets are solved on the main thread, in the same task as the edit, so the new readings
// are in the very frame that shows the moved slider: a worker round trip costs a message each
// way plus waiting for the main thread to finish rendering the edit, several times the solve
// itself. The worker stays for everything else, so the page never freezes: a sheet is solved
// here only while it is small and its solves stay fast, and each solve here has a bounded
// Newton budget (a circuit that needs more goes to the worker, which has the full budget).
import type { Sheet } from '../../../shared/sheet';
import { createIncrementalSolver, type EngineFunctions } from './incrementalSolve';
import type { SolveResult } from './resultTypes';

export interface InlineSolver {
  /** Solve `sheet` now, on this thread; null leaves it to the worker. `ms` is the solve's wall time. */
  trySolve(sheet: Sheet): { result: SolveResult; ms: number } | null;
}

export interface InlinePolicy {
  /** sheets with more parts always go to the worker */
  maxParts: number;
  /**
   * Newton iterations one solve here may take. Plain Newton (150) plus the final polish (30)
   * fit, so a circuit that converges normally gets exactly the worker's answer.
   */
  maxIterations: number;
  /** the median of the recent solve times here must stay below this, ms */
  targetMs: number;
  /** how many recent solves the median looks at; it judges only a full window */
  window: number;
  /** a single solve slower than this (a whole frame) sends the next ones to the worker at once, ms */
  spikeMs: number;
  /** how long the worker keeps a sheet that was too slow here before it is tried here again, ms */
  cooldownMs: number;
}

/**
 * 40 parts is about 40 unknowns: a dense LU step of a few tens of µs, so even a solve that uses
 * the whole 200-iteration budget stays within a few frames, once, before the cooldown. Warm
 * solves of the examples take 0.1–0.3 ms; the first few after loading run before the JIT has
 * compiled the engine and take 1–3 ms, which is why the median looks at a full window and the
 * target leaves room: 3 ms is a fifth of a 60 Hz frame, and even then the inline answer
 * arrives sooner than the worker's, which waits for the main thread to finish rendering the
 * edit. A median rather than single times: wall time includes moments the operating system
 * lends the core to another process, which says nothing about the sheet.
 */
export const INLINE_POLICY: InlinePolicy = { maxParts: 40, maxIterations: 200, targetMs: 3, window: 8, spikeMs: 16, cooldownMs: 2000 };

function median(xs: readonly number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

/** An inline solver over `engine` (the engine's module, loaded by the caller). */
export function createInlineSolver(engine: EngineFunctions, policy: InlinePolicy = INLINE_POLICY, now: () => number = () => performance.now()): InlineSolver {
  const solver = createIncrementalSolver(engine, { maxTotalIterations: policy.maxIterations });
  let recent: number[] = [];
  let workerUntil = -Infinity;
  const sendToWorker = (at: number) => {
    workerUntil = at + policy.cooldownMs;
    recent = [];
  };
  return {
    trySolve(sheet) {
      if (sheet.parts.length > policy.maxParts) return null;
      const started = now();
      if (started < workerUntil) return null;
      let result: SolveResult;
      try {
        result = solver.solve(sheet);
      } catch {
        // never let a solve break the edit that asked for it; the worker reports what went wrong
        sendToWorker(started);
        return null;
      }
      const ms = now() - started;
      // judge the solves an edit of values costs, not the one-off compile of a new structure
      // (that first solve is bounded by the same size and iteration limits)
      if (!solver.compiled) {
        recent.push(ms);
        if (recent.length > policy.window) recent.shift();
        if (ms > policy.spikeMs || (recent.length === policy.window && median(recent) > policy.targetMs)) sendToWorker(started + ms);
      }
      if (!result.ok && result.error.code === 'no_convergence') {
        // out of this budget, maybe not out of the full one: the worker gives the real answer
        sendToWorker(started + ms);
        return null;
      }
      return { result, ms };
    },
  };
}
