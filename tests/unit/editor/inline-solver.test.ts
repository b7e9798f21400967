// When small sheets are solved on the main thread and when they are handed to the worker.
import { describe, expect, it } from 'vitest';
import * as engine from '../../../shared/engine';
import type { Sheet } from '../../../shared/sheet';
import { createInlineSolver, INLINE_POLICY } from '../../../src/editor/solve/inlineSolver';
import type { EngineFunctions } from '../../../src/editor/solve/incrementalSolve';
import { LatestWinsSolver, type SolveOutcome, type SolverHandle } from '../../../src/editor/solve/latestWins';
import type { SolveResult } from '../../../src/editor/solve/resultTypes';
import { emptySheet } from './helpers';

const ok: SolveResult = { ok: true, analysis: 'operating-point', nets: {}, pins: {}, parts: {}, warnings: [], iterations: 1 };

/** A sheet with `n` parts (their content does not matter to a fake engine). */
function sheetOf(n: number, value = 1): Sheet {
  return { ...emptySheet(), parts: Array.from({ length: n }, (_, i) => ({ id: `R${i + 1}`, type: 'resistor', params: { resistance: value } }) as Sheet['parts'][number]) };
}

/** A fake engine whose solves take `cost()` ms on a fake clock. */
function fakeEngine(cost: () => number, result: () => SolveResult = () => ok) {
  const clock = { t: 0 };
  const solve = () => {
    clock.t += cost();
    return result();
  };
  const e: EngineFunctions = {
    compileCircuit: () => ({ error: null, solve }) as unknown as ReturnType<typeof engine.compileCircuit>,
    solveOperatingPoint: solve,
  };
  return { e, clock, now: () => clock.t };
}

describe('inline solving policy', () => {
  it('solves a small sheet at once and leaves a large one to the worker', () => {
    const f = fakeEngine(() => 0.2);
    const inline = createInlineSolver(f.e, INLINE_POLICY, f.now);
    expect(inline.trySolve(sheetOf(8))).not.toBeNull();
    expect(inline.trySolve(sheetOf(INLINE_POLICY.maxParts + 1))).toBeNull();
  });

  it('moves a sheet whose solves stay slow to the worker, and tries again after the cooldown', () => {
    let ms = 0.2;
    const f = fakeEngine(() => ms);
    const inline = createInlineSolver(f.e, INLINE_POLICY, f.now);
    inline.trySolve(sheetOf(8, 1)); // compiles: not judged
    ms = INLINE_POLICY.targetMs * 2;
    let accepted = 0;
    for (let i = 0; i < 20; i++) if (inline.trySolve(sheetOf(8, i + 2))) accepted++;
    // judged on a full window's median: the window's worth goes through, then the worker takes over
    expect(accepted).toBe(INLINE_POLICY.window);
    f.clock.t += INLINE_POLICY.cooldownMs;
    ms = 0.2;
    expect(inline.trySolve(sheetOf(8, 99))).not.toBeNull();
  });

  it('keeps a sheet inline through single slow solves (another process holding the core)', () => {
    let i = 0;
    const f = fakeEngine(() => (++i % 4 === 0 ? 8 : 0.2));
    const inline = createInlineSolver(f.e, INLINE_POLICY, f.now);
    let accepted = 0;
    for (let k = 0; k < 40; k++) if (inline.trySolve(sheetOf(8, k))) accepted++;
    expect(accepted).toBe(40);
  });

  it('hands a solve that runs out of its Newton budget to the worker, which has the full budget', () => {
    const f = fakeEngine(
      () => 1,
      () => ({ ok: false, error: { code: 'no_convergence', message: 'x' } }),
    );
    const inline = createInlineSolver(f.e, INLINE_POLICY, f.now);
    expect(inline.trySolve(sheetOf(8))).toBeNull();
  });

  it('gives the engine a bounded Newton budget', () => {
    let seen: unknown;
    const e: EngineFunctions = {
      compileCircuit: (s, o) => ((seen = o), engine.compileCircuit(s, o)),
      solveOperatingPoint: engine.solveOperatingPoint,
    };
    createInlineSolver(e).trySolve(sheetOf(1));
    expect(seen).toEqual({ maxTotalIterations: INLINE_POLICY.maxIterations });
  });
});

describe('latest-wins with an inline solver', () => {
  it('delivers an inline result before request() returns, and drops the worker answer it overtook', async () => {
    let finish: (r: SolveResult) => void = () => {};
    const make = (): SolverHandle => ({ port: { solve: () => new Promise<SolveResult>((r) => (finish = r)) }, dispose: () => {} });
    const seen: SolveOutcome[] = [];
    let accept = false;
    const s = new LatestWinsSolver(make, {
      onResult: (o) => seen.push(o),
      inline: { trySolve: () => (accept ? { result: ok, ms: 0.1 } : null) },
    });
    s.request(sheetOf(300)); // declined: goes to the worker
    accept = true;
    const seq = s.request(sheetOf(3));
    expect(seen.map((o) => [o.seq, o.where])).toEqual([[seq, 'inline']]);
    finish(ok); // the worker's answer for the older sheet arrives late
    await new Promise((r) => setTimeout(r, 0));
    expect(seen).toHaveLength(1);
  });
});
