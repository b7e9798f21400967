import { expect } from 'vitest';
import { solveOperatingPoint, type SolveOptions, type SolveResult, type SolveSuccess } from '../../../shared/engine';

export function solveOk(sheet: unknown, options?: SolveOptions): SolveSuccess {
  const r: SolveResult = solveOperatingPoint(sheet, options);
  if (!r.ok) throw new Error(`expected a solution, got ${r.error.code}: ${r.error.message}`);
  return r;
}

export function expectRel(actual: number, expected: number, rel: number, abs = 0): void {
  const tol = Math.abs(expected) * rel + abs;
  if (!(Math.abs(actual - expected) <= tol))
    expect.fail(`expected ${actual} to be within ${rel} (relative) of ${expected}; off by ${Math.abs(actual - expected) / Math.abs(expected || 1)}`);
}

/** Deterministic PRNG (mulberry32) for generated test circuits. */
export function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
