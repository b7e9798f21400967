// The solve scheduler: only the newest sheet's result is shown, stale results are dropped,
// and a stalled worker is replaced when edits are waiting.
import { describe, expect, it } from 'vitest';
import type { Sheet } from '../../../shared/sheet';
import { LatestWinsSolver, type SolveOutcome, type SolverHandle } from '../../../src/editor/solve/latestWins';
import type { SolveResult } from '../../../src/editor/solve/resultTypes';
import { emptySheet } from './helpers';

/** A fake worker whose solves finish only when the test says so. */
function controllableWorkers() {
  const calls: Array<{ worker: number; title: string; finish: (r?: SolveResult) => void }> = [];
  const disposed: number[] = [];
  let made = 0;
  const make = (): SolverHandle => {
    const worker = ++made;
    return {
      port: {
        solve: (sheet: Sheet) =>
          new Promise<SolveResult>((resolve) => {
            calls.push({
              worker,
              title: sheet.title ?? '',
              finish: (r) =>
                resolve(r ?? { ok: true, analysis: 'operating-point', nets: { title: sheet.title?.length ?? 0 }, pins: {}, parts: {}, warnings: [], iterations: 1 }),
            });
          }),
      },
      dispose: () => disposed.push(worker),
    };
  };
  return { make, calls, disposed };
}

const sheet = (title: string): Sheet => ({ ...emptySheet(), title });
const tick = () => new Promise((r) => setTimeout(r, 0));

describe('latest-wins solving', () => {
  it('skips the sheets superseded while a solve runs, and shows only the newest result', async () => {
    const w = controllableWorkers();
    const seen: SolveOutcome[] = [];
    const s = new LatestWinsSolver(w.make, { onResult: (o) => seen.push(o) });
    s.request(sheet('a'));
    s.request(sheet('b'));
    s.request(sheet('c'));
    expect(w.calls.map((c) => c.title)).toEqual(['a']); // b was replaced by c before it started
    w.calls[0].finish();
    await tick();
    expect(seen).toEqual([]); // a is stale: c is newer
    expect(w.calls.map((c) => c.title)).toEqual(['a', 'c']);
    w.calls[1].finish();
    await tick();
    expect(seen.map((o) => o.seq)).toEqual([3]);
  });

  it('replaces a stalled worker when a newer sheet is waiting', async () => {
    const w = controllableWorkers();
    let clock = 0;
    const seen: SolveOutcome[] = [];
    const s = new LatestWinsSolver(w.make, { stallMs: 1000, now: () => clock, onResult: (o) => seen.push(o) });
    s.request(sheet('slow'));
    clock = 500;
    s.request(sheet('x'));
    expect(w.disposed).toEqual([]);
    clock = 1600;
    s.request(sheet('newest'));
    expect(w.disposed).toEqual([1]);
    expect(w.calls.at(-1)).toMatchObject({ worker: 2, title: 'newest' });
    w.calls[0].finish(); // the abandoned worker answering late changes nothing
    w.calls.at(-1)!.finish();
    await tick();
    expect(seen.map((o) => o.seq)).toEqual([3]);
  });

  it('turns a crashed solve into an error result the user can act on', async () => {
    const seen: SolveOutcome[] = [];
    const s = new LatestWinsSolver(
      () => ({ port: { solve: () => Promise.reject(new Error('boom')) }, dispose: () => {} }),
      { onResult: (o) => seen.push(o) },
    );
    s.request(sheet('a'));
    await tick();
    expect(seen[0].result.ok).toBe(false);
    expect(!seen[0].result.ok && seen[0].result.error.message).toMatch(/boom.*Undo the last change/);
  });
});
