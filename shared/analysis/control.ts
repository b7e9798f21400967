// Progress and cancellation for long runs (sweeps, Monte Carlo): the run checks every `checkEvery`
// points whether it should stop, and reports progress at the same moments. In a web worker the
// editor passes an AbortSignal (or a shouldStop that reads a shared flag).

export interface RunControl {
  signal?: AbortSignal;
  shouldStop?: () => boolean;
  /** called with (points done, points in this run) */
  onProgress?: (done: number, total: number) => void;
  /** how often to check and report, in points (default 64) */
  checkEvery?: number;
}

/** A checker bound to one run; `tick(done)` returns true when the run must stop. */
export function controller(c: RunControl | undefined, total: number): { tick(done: number): boolean; every: number } {
  const every = Math.max(1, Math.floor(c?.checkEvery ?? 64));
  return {
    every,
    tick(done: number): boolean {
      if (done % every !== 0 && done !== total) return false;
      c?.onProgress?.(done, total);
      return done < total && (c?.signal?.aborted === true || c?.shouldStop?.() === true);
    },
  };
}
