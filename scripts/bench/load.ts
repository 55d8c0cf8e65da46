// Load bench: the app in-process on loopback over a throwaway, seeded database; 50 concurrent readers (10 on
// each main read route) and 10 concurrent uploaders of small geotagged photos, for BENCH_LOAD_SECONDS (60 s by
// default). Prints requests per second, p50/p95/p99 latency, errors and non-2xx answers per route, and the
// process's memory at the start, middle and end. Measures; never asserts a time.
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import autocannon, { type Options as LoadOptions, type Result as LoadResult } from 'autocannon';
import { booleanPointInPolygon, bbox } from '@turf/turf';
import { quantileSorted } from 'simple-statistics';
import { createRandom } from '../../shared/analysis/random.ts';
import { DEMO_PASSWORD, demoFields, demoUsers } from '../seed/demo-scenario.ts';
import { startThrowawayDatabase } from './lib/throwaway-database.ts';
import { photoForm } from './lib/photo-bodies.ts';
import { signInForBench, type BenchSession } from './lib/bench-session.ts';
import type { BenchTable } from './table.ts';

const READERS_PER_ROUTE = 10;
const UPLOADERS = 10;
const BASE_PHOTOS = 24;

async function getJson<T>(baseUrl: string, session: BenchSession, path: string): Promise<T> {
  const res = await fetch(`${baseUrl}${path}`, { headers: { cookie: session.cookie } });
  if (!res.ok) throw new Error(`GET ${path}: ${res.status} ${await res.text()}`);
  return (await res.json()) as T;
}

async function postJson<T>(baseUrl: string, session: BenchSession, path: string, body: object): Promise<T> {
  const res = await fetch(`${baseUrl}${path}`, { method: 'POST', headers: { cookie: session.cookie, 'x-csrf-token': session.csrf, 'content-type': 'application/json' }, body: JSON.stringify(body) });
  if (!res.ok) throw new Error(`POST ${path}: ${res.status} ${await res.text()}`);
  return (await res.json()) as T;
}

/** Positions inside the demo's patchy field (its pond hole excluded), drawn from a seeded generator. */
function pointsInsidePatchyField(count: number) {
  const field = demoFields.find((f) => f.key === 'patchy')!;
  const [west, south, east, north] = bbox(field.boundary);
  const random = createRandom('load-bench');
  const points: Array<{ lon: number; lat: number }> = [];
  while (points.length < count) {
    const p = { lon: west + random() * (east - west), lat: south + random() * (north - south) };
    if (booleanPointInPolygon([p.lon, p.lat], field.boundary)) points.push(p);
  }
  return points;
}

interface RouteLoad {
  label: string;
  latencies: number[];
  result?: LoadResult;
  outcomes: Map<string, number>;
}

function memorySample(label: string) {
  const m = process.memoryUsage();
  return { label, rssMb: m.rss / 2 ** 20, heapMb: m.heapUsed / 2 ** 20 };
}

const fixed = (v: number, digits = 1) => Number(v.toFixed(digits));

/**
 * Waits (at most 30 s) until the requests the clients left in flight at the bell have let go of the model pool,
 * so closing it does not fail them. Reads sequelize-pool's counters, which sequelize does not type.
 */
async function untilDatabaseIdle() {
  const { sequelize } = await import('../../server/db.ts');
  const pool = (sequelize.connectionManager as unknown as { pool?: { using: number; waiting: number } }).pool;
  const deadline = Date.now() + 30_000;
  while (pool && pool.using + pool.waiting > 0 && Date.now() < deadline) await new Promise((resolve) => setTimeout(resolve, 100));
}

export async function run(): Promise<BenchTable> {
  const seconds = Number(process.env.BENCH_LOAD_SECONDS ?? 60);
  if (!Number.isFinite(seconds) || seconds <= 0) throw new Error('BENCH_LOAD_SECONDS must be a positive number of seconds.');
  const database = await startThrowawayDatabase('load');
  let server: Server | null = null;
  try {
    // Server modules read DATABASE_URL when first imported, so they load only now.
    const { seedDemo } = await import('../seed/seed-demo.ts');
    const { createApp } = await import('../../server/app.ts');
    const { makeJpeg } = await import('../../tests/helpers/photos.ts');
    const { ids } = await seedDemo();
    // Web process only: thumbnail jobs queue up for workers, which would otherwise share these two cores.
    const app = createApp();
    server = await new Promise<Server>((resolve) => {
      const s = app.listen(0, '127.0.0.1', () => resolve(s));
    });
    const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

    const email = (role: string) => demoUsers.find((u) => u.role === role)!.email;
    const adviser = await signInForBench(baseUrl, email('adviser'), DEMO_PASSWORD);
    const scout = await signInForBench(baseUrl, email('scout'), DEMO_PASSWORD);
    const fieldId = ids.fields.patchy;
    const sightings = await getJson<{ sightings: Array<{ pestId: string }> }>(baseUrl, adviser, `/api/sightings?fieldId=${fieldId}`);
    const pestId = sightings.sightings[0]?.pestId ?? ids.pests['Soybean aphid'];
    const stored = await postJson<{ check: { id: string; status: string } }>(baseUrl, adviser, '/api/checks', { fieldId, pestId, options: { simulations: 99, seed: 1 } });
    if (stored.check.status !== 'done') throw new Error(`the check to read back did not finish inline (status ${stored.check.status})`);

    const readRoutes = [
      { label: 'GET /api/fields', path: '/api/fields' },
      { label: 'GET /api/fields/:id', path: `/api/fields/${fieldId}` },
      { label: 'GET /api/sightings?fieldId=…', path: `/api/sightings?fieldId=${fieldId}` },
      { label: 'GET /api/checks/:id', path: `/api/checks/${stored.check.id}` },
      { label: 'GET /api/pests', path: '/api/pests' },
    ];
    const basePhotos = await Promise.all(pointsInsidePatchyField(BASE_PHOTOS).map((gps, i) => makeJpeg({ gps: { ...gps, accuracyM: 4 }, markSeed: 1000 + i, width: 160, height: 120, dateTimeOriginal: '2026:07:02 10:00:00', offsetTimeOriginal: '-05:00' })));
    const form = photoForm(basePhotos, { fieldId, pestId, count: '3' });

    const loads: RouteLoad[] = [];
    const start = (label: string, options: Omit<LoadOptions, 'url'>) => {
      const load: RouteLoad = { label, latencies: [], outcomes: new Map() };
      loads.push(load);
      const instance = autocannon({ url: baseUrl, duration: seconds, timeout: 30, ...options });
      instance.on('response', (_client: unknown, _status: number, _bytes: number, ms: number) => load.latencies.push(ms));
      return new Promise<void>((resolve, reject) => {
        instance.on('done', (result: LoadResult) => {
          load.result = result;
          resolve();
        });
        instance.on('error', reject);
      });
    };

    const memory = [memorySample('start')];
    const middle = setTimeout(() => memory.push(memorySample('middle')), (seconds * 1000) / 2);
    const runs = readRoutes.map((route) => start(route.label, { connections: READERS_PER_ROUTE, headers: { cookie: adviser.cookie, 'accept-encoding': 'gzip' }, requests: [{ method: 'GET', path: route.path }] }));
    const uploads = start('POST /api/photos (1 photo each)', {
      connections: UPLOADERS,
      requests: [
        {
          method: 'POST',
          path: '/api/photos',
          setupRequest: (request) => ({ ...request, headers: { ...request.headers, cookie: scout.cookie, 'x-csrf-token': scout.csrf, 'content-type': form.contentType }, body: form.next() }),
          onResponse: (status, body) => {
            const outcome = status === 200 ? ((JSON.parse(body) as { results: Array<{ outcome: string }> }).results[0]?.outcome ?? 'none') : `HTTP ${status}`;
            const upload = loads.find((l) => l.label.startsWith('POST'))!;
            upload.outcomes.set(outcome, (upload.outcomes.get(outcome) ?? 0) + 1);
          },
        },
      ],
    });
    await Promise.all([...runs, uploads]);
    clearTimeout(middle);
    memory.push(memorySample('end'));
    await untilDatabaseIdle();

    const rows: BenchTable['rows'] = loads.map((load) => {
      const sorted = [...load.latencies].sort((a, b) => a - b);
      const r = load.result!;
      const quantile = (q: number) => (sorted.length ? fixed(quantileSorted(sorted, q)) : '');
      return {
        route: load.label,
        clients: r.connections,
        'req/s': fixed(r.requests.average),
        requests: r.requests.total,
        'p50 ms': quantile(0.5),
        'p95 ms': quantile(0.95),
        'p99 ms': quantile(0.99),
        errors: r.errors,
        timeouts: r.timeouts,
        'non-2xx': r.non2xx,
        ...(load.outcomes.size ? { outcomes: [...load.outcomes].map(([k, v]) => `${k} ${v}`).join(', ') } : {}),
      };
    });
    const totals = loads.reduce((sum, l) => ({ requests: sum.requests + l.result!.requests.total, errors: sum.errors + l.result!.errors, non2xx: sum.non2xx + l.result!.non2xx }), { requests: 0, errors: 0, non2xx: 0 });
    rows.push({ route: `all routes, ${seconds} s`, clients: READERS_PER_ROUTE * readRoutes.length + UPLOADERS, 'req/s': fixed(totals.requests / seconds), requests: totals.requests, errors: totals.errors, 'non-2xx': totals.non2xx });
    // One process holds the app and the load generator; heap is this main thread's (autocannon's clients run here too).
    for (const m of memory) rows.push({ route: `memory at ${m.label}`, 'RSS MB': fixed(m.rssMb), 'heap MB': fixed(m.heapMb) });
    return { title: `Load: ${READERS_PER_ROUTE * readRoutes.length} readers and ${UPLOADERS} uploaders for ${seconds} s on loopback (demo data)`, rows };
  } finally {
    if (server) {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server!.close(() => resolve()));
    }
    // The uploads started the job queue; close it and the model pool before their database goes away.
    const [{ stopQueue }, { sequelize }] = await Promise.all([import('../../server/jobs/queue.ts'), import('../../server/db.ts')]);
    await stopQueue().catch(() => {});
    await sequelize.close().catch(() => {});
    database.dispose();
  }
}
