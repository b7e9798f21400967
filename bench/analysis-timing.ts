// Timing helpers shared by bench/linalg.bench.ts and bench/analysis.bench.ts (not a bench itself).

/** Median wall time in ms of `fn` after `warmup` untimed calls; stops early after `budgetMs`. */
export function medianMs(fn: () => void, opts: { warmup?: number; reps?: number; budgetMs?: number } = {}): number {
  const warmup = opts.warmup ?? 3;
  const reps = opts.reps ?? 15;
  const budget = opts.budgetMs ?? 3000;
  for (let i = 0; i < warmup; i++) fn();
  const times: number[] = [];
  const start = performance.now();
  for (let i = 0; i < reps; i++) {
    const t = performance.now();
    fn();
    times.push(performance.now() - t);
    if (performance.now() - start > budget && times.length >= 3) break;
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

/** Wall time in ms of one call (a cold run: includes JIT warm-up, as a user's first solve would). */
export function onceMs(fn: () => void): number {
  const t = performance.now();
  fn();
  return performance.now() - t;
}

export function fmtMs(ms: number | null): string {
  if (ms === null || !Number.isFinite(ms)) return '—';
  return ms < 0.01 ? `${(ms * 1000).toFixed(2)} µs` : ms < 10 ? `${ms.toFixed(3)} ms` : `${ms.toFixed(0)} ms`;
}

/** Heap in use, MiB (after a GC when node runs with --expose-gc). */
export function heapMiB(): number {
  (globalThis as { gc?: () => void }).gc?.();
  return process.memoryUsage().heapUsed / 2 ** 20;
}

/** Print rows as an aligned text table. */
export function printTable(rows: Array<Record<string, string | number>>): void {
  if (rows.length === 0) return;
  const cols = Object.keys(rows[0]);
  const text = rows.map((r) => cols.map((c) => String(r[c] ?? '')));
  const width = cols.map((c, i) => Math.max(c.length, ...text.map((t) => t[i].length)));
  console.log(cols.map((c, i) => c.padEnd(width[i])).join('  '));
  console.log(width.map((w) => '-'.repeat(w)).join('  '));
  for (const t of text) console.log(t.map((v, i) => v.padEnd(width[i])).join('  '));
}
