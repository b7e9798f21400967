// A fixed-size pool of analysis workers. Tasks queue until a worker is free. Cancelling a task
// that is running terminates its worker (a synchronous analysis loop cannot be interrupted any
// other way) and a fresh worker takes its place on the next task; cancelling a queued task just
// drops it. The pool knows nothing about the analyses: a task is a function of the worker's API.
import { JobCancelled } from './jobTypes';

/** One worker as the pool sees it. */
export interface PoolMember<Api> {
  api: Api;
  terminate(): void;
}

interface Slot<Api> {
  member: PoolMember<Api> | null;
  busy: boolean;
}

interface Pending<Api> {
  task: (api: Api) => Promise<unknown>;
  signal?: AbortSignal;
  resolve(v: unknown): void;
  reject(e: unknown): void;
}

/** Workers to start: one per logical core the browser reports, at least 1 and at most 8. */
export function defaultPoolSize(): number {
  const n = typeof navigator !== 'undefined' ? navigator.hardwareConcurrency : 0;
  return Math.max(1, Math.min(8, Number.isFinite(n) && n > 0 ? n : 2));
}

export class WorkerPool<Api> {
  private readonly slots: Slot<Api>[];
  private readonly queue: Pending<Api>[] = [];
  private disposed = false;

  constructor(
    private readonly spawn: () => PoolMember<Api>,
    readonly size: number = defaultPoolSize(),
  ) {
    this.slots = Array.from({ length: Math.max(1, size) }, () => ({ member: null, busy: false }));
  }

  /** Run `task` on a free worker. Rejects with JobCancelled when `signal` aborts first. */
  run<R>(task: (api: Api) => Promise<R>, signal?: AbortSignal): Promise<R> {
    if (this.disposed) return Promise.reject(new Error('The analysis workers were shut down; reload the page.'));
    if (signal?.aborted) return Promise.reject(new JobCancelled());
    return new Promise<R>((resolve, reject) => {
      const p: Pending<Api> = { task, signal, resolve: resolve as (v: unknown) => void, reject };
      this.queue.push(p);
      signal?.addEventListener(
        'abort',
        () => {
          const i = this.queue.indexOf(p);
          if (i >= 0) {
            this.queue.splice(i, 1);
            reject(new JobCancelled());
          }
        },
        { once: true },
      );
      this.pump();
    });
  }

  /** Workers running now (for tests and the progress read-out). */
  get active(): number {
    return this.slots.filter((s) => s.busy).length;
  }

  dispose(): void {
    this.disposed = true;
    for (const p of this.queue.splice(0)) p.reject(new JobCancelled());
    for (const s of this.slots) {
      s.member?.terminate();
      s.member = null;
    }
  }

  private pump(): void {
    for (const slot of this.slots) {
      if (slot.busy || !this.queue.length) continue;
      this.start(slot, this.queue.shift()!);
    }
  }

  private start(slot: Slot<Api>, p: Pending<Api>): void {
    slot.member ??= this.spawn();
    slot.busy = true;
    const member = slot.member;
    let settled = false;
    const finish = (fn: () => void) => {
      if (settled) return;
      settled = true;
      p.signal?.removeEventListener('abort', onAbort);
      slot.busy = false;
      fn();
      if (!this.disposed) this.pump();
    };
    const onAbort = () => {
      // the worker may be deep in a loop: end it, a new one is made for the next task
      member.terminate();
      if (slot.member === member) slot.member = null;
      finish(() => p.reject(new JobCancelled()));
    };
    p.signal?.addEventListener('abort', onAbort, { once: true });
    p.task(member.api).then(
      (v) => finish(() => p.resolve(v)),
      (e) => {
        // a crashed worker is replaced, like a cancelled one
        if (slot.member === member && !(e instanceof JobCancelled)) {
          member.terminate();
          slot.member = null;
        }
        finish(() => p.reject(e));
      },
    );
  }
}
