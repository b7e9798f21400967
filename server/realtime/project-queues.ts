// One queue per project in this process. Batches of a project are committed one group at a time
// (the row lock orders them across processes; the queue keeps this process from piling up
// connections waiting on that lock), and whatever arrived while a transaction was running goes
// into the next one: under load one commit carries many batches.
import { performance } from 'node:perf_hooks';
import type pg from 'pg';
import { commitGroup, type CachedDoc } from './commit';
import type { BatchOutcome, QueuedBatch } from './decide';

/** Most batches one transaction takes. */
const MAX_GROUP = 64;
/** A project's cached document is dropped after this long without a batch, ms. */
const IDLE_MS = 5 * 60_000;

interface Waiting {
  batch: QueuedBatch;
  resolve(outcome: BatchOutcome): void;
}

interface Channel {
  queue: Waiting[];
  running: boolean;
  cache: CachedDoc | null;
  lastUsed: number;
}

export type AcceptedListener = (projectId: string, accepted: { batch: QueuedBatch; version: number }[]) => void;

export class ProjectQueues {
  private channels = new Map<string, Channel>();
  private sweeper: ReturnType<typeof setInterval>;

  constructor(
    private readonly pool: pg.Pool,
    /** called after COMMIT with the accepted batches, before their authors get their answers */
    private readonly onAccepted: AcceptedListener,
    /** told how long each transaction took, ms (benchmark timings) */
    private readonly onCommitTime?: (ms: number) => void,
  ) {
    this.sweeper = setInterval(() => this.sweep(), 60_000);
    this.sweeper.unref();
  }

  /** Queue a batch; resolves with the server's answer once it is committed or refused. */
  submit(projectId: string, batch: QueuedBatch): Promise<BatchOutcome> {
    const ch = this.channel(projectId);
    return new Promise((resolve) => {
      ch.queue.push({ batch, resolve });
      if (!ch.running) void this.run(projectId, ch);
    });
  }

  /** The document this process last committed or read for a project, if still current as far as it knows. */
  cached(projectId: string): CachedDoc | null {
    return this.channels.get(projectId)?.cache ?? null;
  }

  /** Forget the cached document (someone changed the sheet outside the live path). */
  invalidate(projectId: string, newerThan?: number): void {
    const ch = this.channels.get(projectId);
    if (ch?.cache && (newerThan === undefined || ch.cache.version < newerThan)) ch.cache = null;
  }

  /** Resolves when every queued batch has its answer (used at shutdown). */
  async drained(): Promise<void> {
    while ([...this.channels.values()].some((c) => c.running || c.queue.length)) await new Promise((r) => setTimeout(r, 10));
  }

  close(): void {
    clearInterval(this.sweeper);
  }

  private channel(projectId: string): Channel {
    let ch = this.channels.get(projectId);
    if (!ch) {
      ch = { queue: [], running: false, cache: null, lastUsed: Date.now() };
      this.channels.set(projectId, ch);
    }
    ch.lastUsed = Date.now();
    return ch;
  }

  private async run(projectId: string, ch: Channel): Promise<void> {
    ch.running = true;
    try {
      while (ch.queue.length) {
        const group = ch.queue.splice(0, MAX_GROUP);
        const t0 = performance.now();
        const result = await commitGroup(this.pool, projectId, ch.cache, group.map((w) => w.batch));
        this.onCommitTime?.(performance.now() - t0);
        ch.cache = result.cache;
        if (result.accepted.length) this.onAccepted(projectId, result.accepted);
        group.forEach((w, i) => w.resolve(result.outcomes[i]));
      }
    } finally {
      ch.running = false;
    }
  }

  private sweep(): void {
    const now = Date.now();
    for (const [id, ch] of this.channels) if (!ch.running && !ch.queue.length && now - ch.lastUsed > IDLE_MS) this.channels.delete(id);
  }
}
