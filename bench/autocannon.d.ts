/** The few parts of autocannon 8 the benchmark uses (the package ships no types). */
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    headers?: Record<string, string>;
  }
  interface Result {
    requests: { average: number; total: number };
    throughput: { average: number };
    latency: Record<string, number>;
    non2xx: number;
    errors: number;
    timeouts: number;
  }
  type Instance = EventEmitter & PromiseLike<Result>;
  function autocannon(opts: Options): Instance;
  export default autocannon;
}
