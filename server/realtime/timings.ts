// Server-side timing of the live path, for the benchmark only (TAPLINE_REALTIME_TIMINGS=1):
// from a batch arriving on its socket to its broadcast being handed to socket.io, i.e. queueing,
// the transaction (lock, apply, validate, write, commit) and the broadcast.
import { monitorEventLoopDelay, performance, type IntervalHistogram } from 'node:perf_hooks';

const MAX_SAMPLES = 2_000_000;

export interface Percentiles {
  count: number;
  p50: number;
  p95: number;
  p99: number;
  max: number;
}

export interface TimingSummary extends Percentiles {
  /** duration of the database transactions alone (lock, read, write, commit), ms */
  commit: Percentiles;
  /** this process's event-loop delay p99, ms (CPU starvation, GC) */
  loopLagP99: number;
}

function percentiles(samples: number[]): Percentiles {
  const s = samples.sort((a, b) => a - b);
  const at = (p: number) => (s.length ? s[Math.min(s.length - 1, Math.floor((p / 100) * s.length))] : NaN);
  return { count: s.length, p50: at(50), p95: at(95), p99: at(99), max: s.length ? s[s.length - 1] : NaN };
}

export class Timings {
  private samples: number[] = [];
  private commits: number[] = [];
  private lag: IntervalHistogram = monitorEventLoopDelay({ resolution: 5 });

  constructor() {
    this.lag.enable();
  }

  /** One transaction's duration, ms. */
  commit(ms: number): void {
    if (this.commits.length < MAX_SAMPLES) this.commits.push(ms);
  }

  /** Start timing one batch; call the result when it has been answered. */
  start(): () => void {
    const t0 = performance.now();
    return () => {
      if (this.samples.length < MAX_SAMPLES) this.samples.push(performance.now() - t0);
    };
  }

  /** Percentiles (ms) of what was recorded since the last call, which starts afresh. */
  take(): TimingSummary {
    const out = { ...percentiles(this.samples), commit: percentiles(this.commits), loopLagP99: this.lag.percentile(99) / 1e6 };
    this.samples = [];
    this.commits = [];
    this.lag.reset();
    return out;
  }
}
