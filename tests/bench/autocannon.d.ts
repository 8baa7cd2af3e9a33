/** The part of autocannon's API the load script uses (the package ships no types). */
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  export interface Request {
    method?: string;
    path?: string;
    headers?: Record<string, string>;
    body?: string | Buffer;
    setupRequest?: (req: Request, context: Record<string, unknown>) => Request | null | undefined;
    onResponse?: (status: number, body: string, context: Record<string, unknown>, headers: Record<string, string>) => void;
  }

  export interface Options {
    url: string;
    connections?: number;
    duration?: number;
    pipelining?: number;
    timeout?: number;
    headers?: Record<string, string>;
    method?: string;
    body?: string;
    requests?: Request[];
  }

  export interface Histogram {
    average: number; mean: number; stddev: number; min: number; max: number; total: number;
    p50: number; p90: number; p97_5: number; p99: number;
  }

  export interface Result {
    requests: Histogram;
    latency: Histogram;
    throughput: Histogram;
    errors: number;
    timeouts: number;
    non2xx: number;
    duration: number;
    '1xx': number; '2xx': number; '3xx': number; '4xx': number; '5xx': number;
    statusCodeStats: Record<string, { count: number }>;
  }

  export interface Instance extends EventEmitter, PromiseLike<Result> {
    stop(): void;
  }

  function autocannon(opts: Options): Instance;
  export default autocannon;
}
