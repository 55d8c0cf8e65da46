// autocannon ships no types; these are the parts the benchmarks call.
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';
  export interface RawRequest {
    method?: string;
    path?: string;
    headers?: Record<string, string>;
    body?: string | Buffer;
  }
  export interface RequestStep extends RawRequest {
    /** Called before each send; returns the request to send (synchronous). */
    setupRequest?: (request: RawRequest, context: Record<string, unknown>) => RawRequest;
    onResponse?: (status: number, body: string, context: Record<string, unknown>, headers: Record<string, string>) => void;
  }
  export interface Options {
    url: string;
    connections?: number;
    duration?: number;
    /** Seconds before a request counts as timed out. */
    timeout?: number;
    headers?: Record<string, string>;
    requests?: RequestStep[];
  }
  export interface Result {
    connections: number;
    requests: { total: number; average: number };
    /** Milliseconds. */
    latency: { average: number; p50: number; p99: number };
    non2xx: number;
    errors: number;
    timeouts: number;
  }
  interface Instance extends EventEmitter {
    on(event: 'response', listener: (client: unknown, statusCode: number, resBytes: number, responseTimeMs: number) => void): this;
    on(event: 'done', listener: (result: Result) => void): this;
    on(event: 'error', listener: (error: Error) => void): this;
  }
  export function autocannon(options: Options, done?: (error: Error | null, result: Result) => void): Instance;
  export default autocannon;
}
