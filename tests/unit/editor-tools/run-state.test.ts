// A cancelled or failed run leaves the last good result in place.
import { describe, expect, it } from 'vitest';
import { idleRun, startRun, type RunState } from '../../../src/editor/tools/runner/runState';
import { JobCancelled, JobFailed } from '../../../src/editor/tools/runner/jobTypes';

function slot<T>() {
  let state: RunState<T> = idleRun<T>();
  return { get: () => state, set: (u: (p: RunState<T>) => RunState<T>) => void (state = u(state)) };
}
const flush = () => new Promise((r) => setTimeout(r, 0));

describe('startRun', () => {
  it('reports progress and keeps the result with the sheet key it came from', async () => {
    const s = slot<number>();
    let progress: (d: number, t: number) => void = () => {};
    let finish: (v: number) => void = () => {};
    startRun(s.set, (_sig, onProgress) => ((progress = onProgress), new Promise<number>((r) => (finish = r))), 'k1');
    expect(s.get().status).toBe('running');
    progress(25, 100);
    expect(s.get().progress).toBe(0.25);
    finish(42);
    await flush();
    expect(s.get()).toMatchObject({ status: 'done', result: 42, resultKey: 'k1', progress: null });
  });

  it('cancel keeps the previous result and ignores a late answer', async () => {
    const s = slot<number>();
    startRun(s.set, async () => 1, 'k1');
    await flush();
    let finish: (v: number) => void = () => {};
    const h = startRun(s.set, (signal) => new Promise<number>((resolve, reject) => ((finish = resolve), signal.addEventListener('abort', () => reject(new JobCancelled())))), 'k2');
    h.cancel();
    finish(2);
    await flush();
    expect(s.get()).toMatchObject({ status: 'cancelled', result: 1, resultKey: 'k1' });
  });

  it('a failure keeps the previous result and says what failed and where', async () => {
    const s = slot<number>();
    startRun(s.set, async () => 7, 'k1');
    await flush();
    startRun(s.set, async () => Promise.reject(new JobFailed('There is no net "tap".', ['R1'])), 'k2');
    await flush();
    expect(s.get()).toMatchObject({ status: 'failed', result: 7, error: 'There is no net "tap".', errorParts: ['R1'] });
  });
});
