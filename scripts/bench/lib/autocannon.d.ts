// The parts of autocannon's API the benchmarks use (the package ships no types).
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  export interface Request {
    method?: string;
    path?: string;
    headers?: Record<string, string>;
    setupRequest?: (req: Request, context: Record<string, unknown>) => Request;
  }
  export interface Client {
    setHeaders(headers: Record<string, string>): void;
  }
  export interface Options {
    url: string;
    connections?: number;
    pipelining?: number;
    duration?: number;
    amount?: number;
    timeout?: number;
    requests?: Request[];
    setupClient?: (client: Client) => void;
  }
  export interface Histogram {
    average: number;
    p50: number;
    p97_5: number;
    p99: number;
    max: number;
  }
  export interface Result {
    requests: Histogram & { total: number };
    latency: Histogram;
    throughput: Histogram;
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
    '2xx': number;
  }
  export interface Instance extends EventEmitter {
    on(event: 'response', listener: (client: Client, statusCode: number, resBytes: number, responseTime: number) => void): this;
    on(event: string, listener: (...args: any[]) => void): this;
  }
  function autocannon(options: Options, cb?: (err: Error | null, result: Result) => void): Instance & PromiseLike<Result>;
  export default autocannon;
}
