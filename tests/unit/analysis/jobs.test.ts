// Worker entry points: a run split over a pool (chunks as structured clones, merged in any order)
// equals the single-thread run with the same seed, sample for sample.
import { describe, expect, it } from 'vitest';
import { mergeMonteCarloJobs, planChunks, runMonteCarlo, runMonteCarloJob, runSweepJob } from '../../../shared/analysis';
import npnBias from '../../../examples/npn-bias.json';

describe('worker jobs', () => {
  it('Monte Carlo over a pool of three workers equals one thread', () => {
    const options = { outputs: [{ kind: 'current' as const, part: 'Q1', pin: 'c' }, { kind: 'current' as const, part: 'RC', pin: 'a' }], samples: 900, seed: 2024, distribution: 'uniform' as const };
    const plan = planChunks(900, 3, 250);
    // each job crosses a worker boundary as a structured clone
    const chunks = plan.map((c) => runMonteCarloJob(structuredClone({ sheet: npnBias, options, ...c })));
    const merged = mergeMonteCarloJobs(npnBias, options, chunks.reverse());
    const single = runMonteCarlo(npnBias, options);
    expect(merged.outputs).toEqual(single.outputs);
    expect(merged.samples).toBe(900);
    expect(merged.failed).toBe(0);
  });

  it('sweep job from plain data', () => {
    const t = runSweepJob(structuredClone({ sheet: npnBias, spec: { axes: [{ target: { kind: 'param', part: 'V1', param: 'voltage' }, steps: { from: 10, to: 15, points: 6 } }] } }));
    expect(t.points).toBe(6);
    expect(t.errors).toEqual([]);
  });
});

describe('thevenin job', () => {
  it('answers for several nets of one sheet', async () => {
    const { runTheveninJob } = await import('../../../shared/analysis');
    const { divider } = await import('./fixtures');
    const [t] = runTheveninJob(structuredClone({ sheet: divider(), nets: ['tap'] }));
    expect(t.resistance).toBeCloseTo(270000 / 37, 6);
  });
});
