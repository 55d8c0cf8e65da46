// Runs a list of GET routes against a base URL, one route at a time, each with the same number of autocannon
// connections, and gives requests per second and latency quantiles per route. Any server that answers the routes
// can be measured with it (the app, the bare floor server, a second process), so the rows line up route by route.
import autocannon, { type Result as LoadResult } from 'autocannon';
import { quantileSorted } from 'simple-statistics';

export interface BenchRoute {
  label: string;
  path: string;
}

export interface RouteFigures {
  label: string;
  connections: number;
  reqPerSec: number;
  /** Answers received in the run. */
  answered: number;
  p50: number;
  p95: number;
  p99: number;
  errors: number;
  non2xx: number;
}

export interface RouteLoadOptions {
  seconds: number;
  connections: number;
  headers?: Record<string, string>;
}

/** Latencies of every answer (autocannon's own histogram rounds to whole milliseconds). */
export function loadOneRoute(baseUrl: string, route: BenchRoute, options: RouteLoadOptions): Promise<RouteFigures> {
  const latencies: number[] = [];
  const instance = autocannon({
    url: `${baseUrl}${route.path}`,
    duration: options.seconds,
    connections: options.connections,
    timeout: 30,
    headers: options.headers,
  });
  instance.on('response', (_client: unknown, _status: number, _bytes: number, ms: number) => latencies.push(ms));
  return new Promise((resolve, reject) => {
    instance.on('error', reject);
    instance.on('done', (result: LoadResult) => {
      const sorted = latencies.sort((a, b) => a - b);
      const q = (p: number) => (sorted.length ? quantileSorted(sorted, p) : NaN);
      resolve({
        label: route.label,
        connections: result.connections,
        reqPerSec: result.requests.average,
        answered: sorted.length,
        p50: q(0.5),
        p95: q(0.95),
        p99: q(0.99),
        errors: result.errors + result.timeouts,
        non2xx: result.non2xx,
      });
    });
  });
}

/** Each route alone, in turn, so one route's figures are not another's queueing. */
export async function loadRoutes(baseUrl: string, routes: BenchRoute[], options: RouteLoadOptions): Promise<RouteFigures[]> {
  const figures: RouteFigures[] = [];
  for (const route of routes) figures.push(await loadOneRoute(baseUrl, route, options));
  return figures;
}
