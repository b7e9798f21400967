// The pool's scheduling and cancellation with stand-in workers (no real threads): a cancelled
// running task ends its worker, a queued one never starts, a crashed worker is replaced.
import { describe, expect, it } from 'vitest';
import { WorkerPool, type PoolMember } from '../../../src/editor/tools/runner/workerPool';
import { JobCancelled } from '../../../src/editor/tools/runner/jobTypes';

interface FakeApi {
  id: number;
  wait(): Promise<number>;
  release(): void;
}

function fakes() {
  const made: Array<{ id: number; terminated: boolean; releases: Array<() => void> }> = [];
  const spawn = (): PoolMember<FakeApi> => {
    const rec = { id: made.length + 1, terminated: false, releases: [] as Array<() => void> };
    made.push(rec);
    return {
      api: {
        id: rec.id,
        wait: () => new Promise<number>((resolve) => rec.releases.push(() => resolve(rec.id))),
        release: () => rec.releases.shift()?.(),
      },
      terminate: () => void (rec.terminated = true),
    };
  };
  return { made, spawn };
}

const tick = () => new Promise((r) => setTimeout(r, 0));

describe('WorkerPool', () => {
  it('runs at most `size` tasks at once and queues the rest', async () => {
    const f = fakes();
    const pool = new WorkerPool(f.spawn, 2);
    const apis: FakeApi[] = [];
    const runs = [1, 2, 3].map(() => pool.run((api) => (apis.push(api), api.wait())));
    await tick();
    expect(pool.active).toBe(2);
    expect(f.made).toHaveLength(2);
    apis[0].release();
    expect(await runs[0]).toBe(1);
    await tick();
    // the third task reuses the freed worker
    expect(f.made).toHaveLength(2);
    apis[2].release();
    apis[1].release();
    expect(await Promise.all(runs)).toEqual([1, 2, 1]);
  });

  it('cancelling a running task terminates its worker and a fresh one takes the next task', async () => {
    const f = fakes();
    const pool = new WorkerPool(f.spawn, 1);
    const ctl = new AbortController();
    const first = pool.run((api) => api.wait(), ctl.signal);
    await tick();
    ctl.abort();
    await expect(first).rejects.toBeInstanceOf(JobCancelled);
    expect(f.made[0].terminated).toBe(true);
    let api2: FakeApi | null = null;
    const second = pool.run((api) => ((api2 = api), api.wait()));
    await tick();
    expect(api2!.id).toBe(2);
    api2!.release();
    expect(await second).toBe(2);
  });

  it('cancelling a queued task drops it without starting or ending any worker', async () => {
    const f = fakes();
    const pool = new WorkerPool(f.spawn, 1);
    let api1: FakeApi | null = null;
    const first = pool.run((api) => ((api1 = api), api.wait()));
    const ctl = new AbortController();
    let started = false;
    const queued = pool.run(async () => ((started = true), 0), ctl.signal);
    ctl.abort();
    await expect(queued).rejects.toBeInstanceOf(JobCancelled);
    await tick();
    api1!.release();
    expect(await first).toBe(1);
    expect(started).toBe(false);
    expect(f.made.map((m) => m.terminated)).toEqual([false]);
  });

  it('an already-aborted signal rejects at once; a crashed task replaces its worker', async () => {
    const f = fakes();
    const pool = new WorkerPool(f.spawn, 1);
    const ctl = new AbortController();
    ctl.abort();
    await expect(pool.run(async () => 1, ctl.signal)).rejects.toBeInstanceOf(JobCancelled);
    await expect(pool.run(async () => Promise.reject(new Error('worker died')))).rejects.toThrow('worker died');
    expect(f.made[0].terminated).toBe(true);
    expect(await pool.run(async (api) => api.id)).toBe(2);
  });
});
