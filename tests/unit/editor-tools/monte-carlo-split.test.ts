// The pool's Monte Carlo split must not change the answer: each sample draws from its own random
// substream (shared/analysis/prng.ts), so chunks over any number of workers give the statistics
// of one single-thread run with the same seed. Checked with an in-thread stand-in for the workers.
import { describe, expect, it } from 'vitest';
import { mergeMonteCarloJobs, runMonteCarlo, runMonteCarloJob, runWorstCaseJob, type MonteCarloOptions } from '../../../shared/analysis';
import { WorkerPool } from '../../../src/editor/tools/runner/workerPool';
import { monteCarloJob, worstCaseJob } from '../../../src/editor/tools/runner/jobs';
import type { AnalysisApi } from '../../../src/editor/tools/runner/analysisPool';
import { toleranceRequest } from '../../../src/editor/tools/tolerance/toleranceRun';
import { divider } from './helpers';

const inThread = {
  monteCarloChunk: async (sheet: unknown, o: MonteCarloOptions, start: number, count: number) => ({ ok: true as const, value: runMonteCarloJob({ sheet, options: o, start, count }) }),
  summarizeMonteCarlo: async (sheet: unknown, o: MonteCarloOptions, chunks: never[]) => ({ ok: true as const, value: mergeMonteCarloJobs(sheet, o, chunks) }),
  worstCase: async (sheet: unknown, o: never) => ({ ok: true as const, value: runWorstCaseJob({ sheet, options: o }) }),
} as unknown as AnalysisApi;

describe('monteCarloJob over a pool', () => {
  it('equals the single-thread run with the same seed, and reports progress to the end', async () => {
    const sheet = divider(0.05);
    const req = toleranceRequest({ outputs: ['V(tap)'], samples: 1000, seed: 7, distribution: 'uniform', windows: { 'V(tap)': { min: '3.1', max: '3.4 V' } }, supplyRange: true });
    if (!req.ok) throw new Error(req.message);
    const pool = new WorkerPool(() => ({ api: inThread, terminate() {} }), 3);
    const seen: number[] = [];
    const split = await monteCarloJob(pool, sheet, req.monteCarlo, { onProgress: (d) => seen.push(d) });
    const single = runMonteCarlo(sheet, req.monteCarlo);
    expect(split.outputs[0].stats.mean).toBe(single.outputs[0].stats.mean);
    expect(split.outputs[0].stats.std).toBe(single.outputs[0].stats.std);
    expect(split.outputs[0].stats.yield?.pass).toBe(single.outputs[0].stats.yield?.pass);
    expect(seen.at(-1)).toBe(1000);
    // uniform ±5 % parts: the mean sits near the exact 3.24415 V (references.md, second-order bias), σ ≈ 2.98 % of it
    expect(split.outputs[0].stats.mean).toBeCloseTo(3.2441500537, 1);
    expect(split.outputs[0].stats.std / 3.2441500537).toBeGreaterThan(0.027);
    expect(split.outputs[0].stats.std / 3.2441500537).toBeLessThan(0.033);
  });

  it('the worst case through the pool gives the closed-form corners 3.01188903567 … 3.48547717842 V (references.md)', async () => {
    const pool = new WorkerPool(() => ({ api: inThread, terminate() {} }), 1);
    const wc = await worstCaseJob(pool, divider(0.05), { outputs: [{ kind: 'net', net: 'tap' }] });
    expect(wc.outputs[0].min.value).toBeCloseTo(3.01188903567, 9);
    expect(wc.outputs[0].max.value).toBeCloseTo(3.48547717842, 9);
  });

  it('a cancelled run rejects and leaves no task running', async () => {
    const pool = new WorkerPool(() => ({ api: inThread, terminate() {} }), 2);
    const ctl = new AbortController();
    const req = toleranceRequest({ outputs: ['V(tap)'], samples: 500, seed: 1, distribution: 'normal', windows: {}, supplyRange: true });
    if (!req.ok) throw new Error(req.message);
    const p = monteCarloJob(pool, divider(), req.monteCarlo, { signal: ctl.signal });
    ctl.abort();
    await expect(p).rejects.toThrow(/cancelled/);
    expect(pool.active).toBe(0);
  });
});

describe('toleranceRequest', () => {
  it('reads spec windows with units and says what is wrong', () => {
    const base = { outputs: ['V(tap)'], samples: 100, seed: 1, distribution: 'normal' as const, supplyRange: true };
    const ok = toleranceRequest({ ...base, windows: { 'V(tap)': { min: '3.1', max: '3400 mV' } } });
    expect(ok.ok && ok.monteCarlo.windows).toEqual({ 'V(tap)': { min: 3.1, max: 3.4 } });
    const swapped = toleranceRequest({ ...base, windows: { 'V(tap)': { min: '4', max: '3' } } });
    expect(!swapped.ok && swapped.message).toMatch(/swap them/);
    const bad = toleranceRequest({ ...base, windows: { 'V(tap)': { min: '3 A', max: '' } } });
    expect(!bad.ok && bad.message).toMatch(/lower limit/);
    expect(toleranceRequest({ ...base, samples: 5, windows: {} }).ok).toBe(false);
  });
});
