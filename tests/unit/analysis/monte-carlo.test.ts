// Monte Carlo of the worked divider against the law of propagation of uncertainty, JCGM 100:2008
// (GUM) §5.1.2, first order: σ_V/V = S·√(σ₁² + σ₂²), S = R₁/(R₁+R₂), with σ = t/√3 for a uniform
// distribution over ±t and σ = t/3 for a normal one with ±t at 3σ (common practice). Tolerances:
// a few standard errors of the estimate for the fixed seed's sample size. The second-order bias of
// the mean (exact mean 3.24415005373 V for uniform inputs against the nominal 3.24324324324 V,
// shared/references.md, computed) is visible with 200,000 samples.
import { describe, expect, it } from 'vitest';
import { prepareCircuit, runMonteCarlo, runMonteCarloChunk, summarizeMonteCarlo, chunkRanges, planChunks } from '../../../shared/analysis';
import { divider } from './fixtures';

const tap = { kind: 'net', net: 'tap' } as const;
const V0 = 3.24324324324;
const S = 27 / 37;

describe('Monte Carlo of the 27 kΩ / 10 kΩ ±5 % divider', () => {
  it('uniform: mean and σ agree with first-order propagation; the mean shows the second-order bias', () => {
    const n = 200_000;
    const r = runMonteCarlo(divider(), { outputs: [tap], samples: n, seed: 20240601, distribution: 'uniform' });
    const st = r.outputs[0].stats;
    expect(st.count).toBe(n);
    const sigmaFirstOrder = V0 * S * Math.sqrt(2 * (0.05 / Math.sqrt(3)) ** 2); // 2.9791 % of V0
    const seMean = sigmaFirstOrder / Math.sqrt(n);
    // standard error of a sample σ ≈ σ/√(2(n−1)) (near-normal output)
    const seStd = sigmaFirstOrder / Math.sqrt(2 * (n - 1));
    expect(Math.abs(st.std - sigmaFirstOrder)).toBeLessThan(4 * seStd);
    // the exact mean (references.md) within 3 standard errors …
    expect(Math.abs(st.mean - 3.24415005373)).toBeLessThan(3 * seMean);
    // … and the nominal value is not: the bias 0.907 mV is about 4 standard errors here
    expect(st.mean - V0).toBeGreaterThan(1.5 * seMean);
    // uniform inputs bound the output by the worst-case corners (references.md)
    expect(st.min).toBeGreaterThanOrEqual(3.01188903567);
    expect(st.max).toBeLessThanOrEqual(3.48547717842);
  }, 120_000);

  it('normal (±t = 3σ): σ agrees with first-order propagation', () => {
    const n = 20_000;
    const r = runMonteCarlo(divider(), { outputs: [tap], samples: n, seed: 7, distribution: 'normal' });
    const st = r.outputs[0].stats;
    const sigma = V0 * S * Math.sqrt(2 * (0.05 / 3) ** 2);
    expect(Math.abs(st.std - sigma)).toBeLessThan(4 * (sigma / Math.sqrt(2 * (n - 1))));
    expect(Math.abs(st.mean - V0)).toBeLessThan(4 * (sigma / Math.sqrt(n)));
    // the 0.135 / 99.865 percentiles of a normal output are μ ∓ 3σ; the standard error of a sample
    // quantile is √(p(1−p)/n)/f(x_p) ≈ 0.059σ here (the output is nearly normal: a ratio of normals)
    const seQ = Math.sqrt((0.00135 * 0.99865) / n) / (Math.exp(-4.5) / Math.sqrt(2 * Math.PI)) * sigma;
    expect(Math.abs(st.percentiles['0.135'] - (V0 - 3 * sigma))).toBeLessThan(4 * seQ);
    expect(Math.abs(st.percentiles['99.865'] - (V0 + 3 * sigma))).toBeLessThan(4 * seQ);
    expect(st.histogram.counts.reduce((a, b) => a + b, 0)).toBe(n);
  }, 60_000);

  it('is reproducible from the seed, and chunking does not change a single sample', () => {
    const p = prepareCircuit(divider());
    const o = { outputs: [tap], samples: 3000, seed: 99, distribution: 'uniform' as const, windows: { 'V(tap)': { min: 3.1, max: 3.4 } } };
    const whole = runMonteCarloChunk(p, o, 0, 3000);
    const parts = chunkRanges(3000, 4).map((c) => runMonteCarloChunk(p, o, c.start, c.count));
    const joined = Float64Array.from(parts.flatMap((c) => Array.from(c.values[0])));
    expect(Array.from(joined)).toEqual(Array.from(whole.values[0]));
    const a = summarizeMonteCarlo(p, o, [whole]);
    const b = summarizeMonteCarlo(p, o, [...parts].reverse());
    expect(b.outputs[0].stats).toEqual(a.outputs[0].stats);
    expect(runMonteCarlo(p, o).outputs[0].stats.mean).toBe(a.outputs[0].stats.mean);
    const other = runMonteCarlo(p, { ...o, seed: 100 });
    expect(other.outputs[0].stats.mean).not.toBe(a.outputs[0].stats.mean);
    // yield: within the window, counted against every sample
    const y = a.outputs[0].stats.yield!;
    expect(y.total).toBe(3000);
    expect(y.fraction).toBeGreaterThan(0.5);
    expect(y.interval95[0]).toBeLessThan(y.fraction);
    expect(y.interval95[1]).toBeGreaterThan(y.fraction);
  });

  it('plans chunks that cover every sample once', () => {
    const plan = planChunks(10_001, 3, 1000);
    expect(plan.length).toBe(11);
    expect(plan[0].start).toBe(0);
    for (let i = 1; i < plan.length; i++) expect(plan[i].start).toBe(plan[i - 1].start + plan[i - 1].count);
    expect(plan.at(-1)!.start + plan.at(-1)!.count).toBe(10_001);
  });

  it('stops when asked and reports progress', () => {
    const ac = new AbortController();
    const seen: number[] = [];
    const r = runMonteCarlo(divider(), { outputs: [tap], samples: 5000, seed: 1 }, {
      signal: ac.signal,
      checkEvery: 100,
      onProgress: (done) => {
        seen.push(done);
        if (done >= 300) ac.abort();
      },
    });
    expect(r.stopped).toBe(true);
    expect(r.samples).toBe(300);
    expect(seen).toEqual([100, 200, 300]);
  });
});

describe('combined yield', () => {
  it('counts samples where every windowed output is in spec', () => {
    const o = {
      outputs: [tap, { kind: 'current' as const, part: 'R1', pin: 'a' }],
      samples: 2000,
      seed: 5,
      distribution: 'uniform' as const,
      windows: { 'V(tap)': { min: 3.2 }, 'I(R1.a)': { max: 12 / 37000 } },
    };
    const r = runMonteCarlo(divider(), o);
    const [a, b] = r.outputs.map((x) => x.stats.yield!.pass);
    expect(r.combinedYield!.pass).toBeLessThanOrEqual(Math.min(a, b));
    expect(r.combinedYield!.pass).toBeGreaterThanOrEqual(a + b - 2000);
    // recount from the raw samples
    const chunk = runMonteCarloChunk(prepareCircuit(divider()), o, 0, 2000);
    let pass = 0;
    for (let i = 0; i < 2000; i++) if (chunk.values[0][i] >= 3.2 && chunk.values[1][i] <= 12 / 37000) pass++;
    expect(r.combinedYield!.pass).toBe(pass);
  });
});
