// The part of autocannon's programmatic API the HTTP load bench uses (the package ships no types).
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  export interface Histogram {
    average: number;
    mean: number;
    stddev: number;
    min: number;
    max: number;
    total: number;
    p50: number;
    p90: number;
    p97_5: number;
    p99: number;
    p99_9: number;
  }

  export interface Result {
    requests: Histogram;
    latency: Histogram;
    throughput: Histogram;
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
    '2xx': number;
    statusCodeStats: Record<string, { count: number }>;
  }

  export interface Client extends EventEmitter {
    setHeadersAndBody(headers: Record<string, string>, body: string | Buffer): void;
    setBody(body: string | Buffer): void;
  }

  export interface Request {
    method?: string;
    path?: string;
    headers?: Record<string, string>;
    body?: string | Buffer;
    onResponse?: (status: number, body: string, context: Record<string, unknown>) => void;
  }

  export interface Options {
    url: string;
    connections?: number;
    duration?: number;
    pipelining?: number;
    timeout?: number;
    method?: string;
    headers?: Record<string, string>;
    body?: string;
    requests?: Request[];
    setupClient?: (client: Client) => void;
  }

  function autocannon(opts: Options): Promise<Result>;
  export default autocannon;
}
