// autocannon ships no types; these are the parts the benchmarks call.
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';
  interface Options {
    url: string;
    connections?: number;
    duration?: number;
    headers?: Record<string, string>;
  }
  export interface Result {
    requests: { total: number; average: number };
    non2xx: number;
    errors: number;
    timeouts: number;
  }
  interface Instance extends EventEmitter {
    on(event: 'response', listener: (client: unknown, statusCode: number, resBytes: number, responseTimeMs: number) => void): this;
  }
  export function autocannon(options: Options, done: (error: Error | null, result: Result) => void): Instance;
  export default autocannon;
}
