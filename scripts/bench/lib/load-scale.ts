// Requests per second with one and with two web processes behind the loopback balancer (scripts/lib/web-balancer.ts),
// the read routes only so both runs see the same data. Each web process is a load server of its own (workers off).
import autocannon, { type Result as LoadResult } from 'autocannon';
import { startBehindBalancer } from '../../lib/web-balancer.ts';
import { startLoadServer, type LoadServer } from './load-server-process.ts';
import type { BenchTable } from '../table.ts';

const CONNECTIONS = 50;

function readLoad(baseUrl: string, paths: string[], cookie: string, seconds: number) {
  return new Promise<LoadResult>((resolve, reject) => {
    const instance = autocannon({
      url: baseUrl,
      connections: CONNECTIONS,
      duration: seconds,
      timeout: 30,
      headers: { cookie, 'accept-encoding': 'gzip' },
      requests: paths.map((path) => ({ method: 'GET', path })),
    });
    instance.on('done', resolve);
    instance.on('error', reject);
  });
}

export async function webProcessScaling(env: NodeJS.ProcessEnv, paths: string[], cookie: string, seconds: number): Promise<BenchTable> {
  const rows: BenchTable['rows'] = [];
  for (const count of [1, 2]) {
    const servers: LoadServer[] = [];
    try {
      const { balancer } = await startBehindBalancer(count, async () => {
        const server = await startLoadServer(env);
        servers.push(server);
        return { port: Number(new URL(server.baseUrl).port) };
      });
      try {
        const r = await readLoad(balancer.baseUrl, paths, cookie, seconds);
        rows.push({
          'web processes': count,
          clients: CONNECTIONS,
          'req/s': Number(r.requests.average.toFixed(1)),
          requests: r.requests.total,
          'p50 ms': r.latency.p50,
          'p99 ms': r.latency.p99,
          errors: r.errors,
          'non-2xx': r.non2xx,
          'connections per process': balancer.connections().join(' / '),
        });
      } finally {
        await balancer.close();
      }
    } finally {
      for (const server of servers) await server.stop();
    }
  }
  return {
    title: `Web processes behind the loopback balancer: the ${paths.length} read routes in turn, ${CONNECTIONS} connections, ${seconds} s each (one machine: the processes share its cores with PostgreSQL and the load generator)`,
    rows,
  };
}
