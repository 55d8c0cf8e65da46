// Load bench: the app server in a child process of its own (lib/load-server.ts) on loopback over a throwaway,
// seeded database; from this process, autocannon holds 50 concurrent readers (10 on each main read route) and
// 10 concurrent uploaders of small geotagged photos for BENCH_LOAD_SECONDS (60 s by default). Prints requests
// per second, p50/p95/p99 latency, errors and non-2xx answers per route; the server's memory after a forced GC
// every 5 s; and the slope of that memory over the second half of the run. Measures; never asserts a time.
import autocannon, { type Options as LoadOptions, type Result as LoadResult } from 'autocannon';
import { quantileSorted } from 'simple-statistics';
import { DEMO_PASSWORD, demoUsers } from '../seed/demo-scenario.ts';
import { pointsInsideField } from './lib/field-points.ts';
import { startThrowawayDatabase } from './lib/throwaway-database.ts';
import { photoForm } from './lib/photo-bodies.ts';
import { signInForBench, type BenchSession } from './lib/bench-session.ts';
import { startLoadServer, type LoadServer, type ServerMemory } from './lib/load-server-process.ts';
import { memoryTrend } from './lib/memory-trend.ts';
import { webProcessScaling } from './lib/load-scale.ts';
import { loadOneRoute, loadRoutes, type BenchRoute, type RouteFigures } from './lib/route-load.ts';
import { startCeilingProcess } from './lib/stack-ceiling.ts';
import { recordAnswer, startFloorProcess, type RecordedAnswer } from './lib/floor-server.ts';
import type { BenchTable } from './table.ts';

const READERS_PER_ROUTE = 10;
/** Connections on one route at a time in the beside-the-floor table. */
const SOLO_CONNECTIONS = 50;
const UPLOADERS = 10;
const BASE_PHOTOS = 24;
/** Each sample forces a full GC in the server (a pause of its event loop), so not more often than this. */
const SAMPLE_EVERY_MS = 5_000;
/**
 * Below these slopes (MB per minute, over the second half) a measure counts as flat. A bench figure, not a test
 * assertion; set from what this bench showed on 2 cores. The one leak it has found (exifr keeping its options per
 * upload) grew the post-GC heap by 6.6–9 MB/min at ~19 uploads/s; a clean 60 s run still shows up to ~0.8 MB/min
 * while compiled code grows, a clean 300 s run ~0.1. External swings ±3 MB between samples with the upload bodies
 * and gzip streams in flight at the GC, and RSS ±5 MB as the allocator takes and hands back pages, so over the
 * seven samples of a 60 s run their slopes wander by several MB/min with nothing kept; a 300 s run resolves
 * about a tenth of each tolerance.
 */
const HEAP_TOLERANCE_MB_PER_MIN = 2;
const EXTERNAL_TOLERANCE_MB_PER_MIN = 4;
const RSS_TOLERANCE_MB_PER_MIN = 10;

async function getJson<T>(baseUrl: string, session: BenchSession, path: string): Promise<T> {
  const res = await fetch(`${baseUrl}${path}`, { headers: { cookie: session.cookie } });
  if (!res.ok) throw new Error(`GET ${path}: ${res.status} ${await res.text()}`);
  return (await res.json()) as T;
}

async function postJson<T>(baseUrl: string, session: BenchSession, path: string, body: object): Promise<T> {
  const res = await fetch(`${baseUrl}${path}`, {
    method: 'POST',
    headers: { cookie: session.cookie, 'x-csrf-token': session.csrf, 'content-type': 'application/json' },
    body: JSON.stringify(body),
  });
  if (!res.ok) throw new Error(`POST ${path}: ${res.status} ${await res.text()}`);
  return (await res.json()) as T;
}

interface RouteLoad {
  label: string;
  latencies: number[];
  result?: LoadResult;
  outcomes: Map<string, number>;
}

const fixed = (v: number, digits = 1) => Number(v.toFixed(digits));
const mb = (bytes: number) => bytes / 2 ** 20;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
const toPoint = (seconds: number, m: ServerMemory) => ({
  seconds,
  heapMb: mb(m.heapUsed),
  externalMb: mb(m.external),
  arrayBuffersMb: mb(m.arrayBuffers),
  rssMb: mb(m.rss),
});
type SamplePoint = ReturnType<typeof toPoint>;

/** Samples the server's memory on a fixed 5 s schedule until `stop()`; a slow answer (GC under load) delays only its own sample. */
function sampleMemoryEvery(server: LoadServer, startedAt: number) {
  const points: SamplePoint[] = [];
  let running = true;
  let failure: unknown = null;
  const loop = (async () => {
    for (let k = 1; ; k++) {
      await sleep(Math.max(0, startedAt + k * SAMPLE_EVERY_MS - performance.now()));
      if (!running) return;
      // Timers may fire a millisecond early; the schedule's own time keeps the warm-up cut exact.
      const seconds = (k * SAMPLE_EVERY_MS) / 1000;
      const m = await server.memory();
      points.push(toPoint(seconds, m));
    }
  })().catch((error: unknown) => {
    // Kept for stop(): a server that stopped answering ends the sampling, and the run reports why.
    failure = error;
  });
  return {
    points,
    stop: async () => {
      running = false;
      await loop;
      if (failure) throw failure;
    },
  };
}

const ms = (v: number) => (Number.isNaN(v) ? '' : fixed(v));

/**
 * Each read route alone at SOLO_CONNECTIONS connections, signed in, against the app, and the same paths against a
 * bare node:http server in a process of its own answering the bytes the app gave (the floor). Same run, same machine.
 */
async function besideTheFloor(server: LoadServer, routes: BenchRoute[], headers: Record<string, string>): Promise<BenchTable> {
  const baseUrl = server.baseUrl;
  const seconds = Number(process.env.BENCH_SOLO_SECONDS ?? 5);
  const answers = new Map<string, RecordedAnswer>();
  for (const route of routes) answers.set(route.path, await recordAnswer(baseUrl, route.path, headers));
  const floor = await startFloorProcess(answers);
  let floorFigures: RouteFigures[];
  try {
    floorFigures = await loadRoutes(floor.baseUrl, routes, { seconds, connections: SOLO_CONNECTIONS });
  } finally {
    await floor.stop();
  }
  // The server's own CPU per answer, from process.cpuUsage() around each route: unlike requests/s it hardly moves
  // when other work shares the machine, so runs on a busy and a quiet machine can be compared.
  const appFigures: Array<RouteFigures & { cpuMsPerAnswer: number }> = [];
  for (const route of routes) {
    const before = await server.cpu();
    const [figures] = await loadRoutes(baseUrl, [route], { seconds, connections: SOLO_CONNECTIONS, headers });
    const after = await server.cpu();
    const cpuMs = (after.user + after.system - before.user - before.system) / 1000;
    appFigures.push({ ...figures, cpuMsPerAnswer: figures.answered ? cpuMs / figures.answered : NaN });
  }
  return {
    title: `Reads beside the floor: each route alone, ${SOLO_CONNECTIONS} connections, ${seconds} s, signed in, gzip accepted (floor = bare node:http answering the same bytes, in its own process)`,
    rows: appFigures.map((app, i) => {
      const bare = floorFigures[i];
      return {
        route: app.label,
        'answer bytes': answers.get(routes[i].path)!.body.length,
        'floor req/s': fixed(bare.reqPerSec),
        'floor p95 ms': ms(bare.p95),
        'app req/s': fixed(app.reqPerSec),
        'app p50 ms': ms(app.p50),
        'app p95 ms': ms(app.p95),
        'app p99 ms': ms(app.p99),
        'app CPU ms/answer': Number.isNaN(app.cpuMsPerAnswer) ? '' : app.cpuMsPerAnswer.toFixed(3),
        'of floor %': fixed((100 * app.reqPerSec) / bare.reqPerSec),
        'errors + non-2xx': app.errors + app.non2xx,
      };
    }),
  };
}

/**
 * GET /api/config on four servers in turn, each in its own process, at SOLO_CONNECTIONS connections: the floor, the
 * app's framework answering the same bytes with nothing else, the framework with only the session and user read,
 * and the app. Where the app sits between them says how much of its cost is its own middleware and how much the
 * stack it is built on.
 */
async function beneathTheApp(server: LoadServer, headers: Record<string, string>): Promise<BenchTable> {
  const seconds = Number(process.env.BENCH_SOLO_SECONDS ?? 5);
  const route = { label: 'GET /api/config', path: '/api/config' };
  const answer = await recordAnswer(server.baseUrl, route.path, headers);
  const options = { seconds, connections: SOLO_CONNECTIONS, headers };
  // A fresh process runs its first thousands of requests before the JIT has compiled them; the app is already warm
  // from the table before, so each new server gets a second of the same load first.
  const warmedUp = async (baseUrl: string) => {
    await loadOneRoute(baseUrl, route, { ...options, seconds: 1 });
    return loadOneRoute(baseUrl, route, options);
  };
  const measured: Array<{ server: string; figures: RouteFigures }> = [];
  const floor = await startFloorProcess(new Map([[route.path, answer]]));
  try {
    measured.push({ server: 'floor: bare node:http, same bytes', figures: await warmedUp(floor.baseUrl) });
  } finally {
    await floor.stop();
  }
  for (const [mode, label] of [
    ['express', 'Express alone, same bytes'],
    ['express-session', 'Express + express-session (app store) + passport.session()'],
  ] as const) {
    const ceiling = await startCeilingProcess(mode, answer);
    try {
      measured.push({ server: label, figures: await warmedUp(ceiling.baseUrl) });
    } finally {
      await ceiling.stop();
    }
  }
  measured.push({ server: 'the app', figures: await loadOneRoute(server.baseUrl, route, options) });
  const floorRate = measured[0].figures.reqPerSec;
  return {
    title: `Beneath the app: GET /api/config (signed in) on each server alone, ${SOLO_CONNECTIONS} connections, ${seconds} s, each in its own process`,
    rows: measured.map(({ server: label, figures }) => ({
      server: label,
      'req/s': fixed(figures.reqPerSec),
      'p50 ms': ms(figures.p50),
      'p95 ms': ms(figures.p95),
      'of floor %': fixed((100 * figures.reqPerSec) / floorRate),
      'errors + non-2xx': figures.errors + figures.non2xx,
    })),
  };
}

export async function run(): Promise<BenchTable[]> {
  const seconds = Number(process.env.BENCH_LOAD_SECONDS ?? 60);
  if (!Number.isFinite(seconds) || seconds <= 0) throw new Error('BENCH_LOAD_SECONDS must be a positive number of seconds.');
  const database = await startThrowawayDatabase('load');
  let server: LoadServer | null = null;
  try {
    // Seeding uses this process's models (they read DATABASE_URL when first imported, so they load only now);
    // their pool closes before the server starts, so this process holds no server work during the run.
    const { seedDemo } = await import('../seed/seed-demo.ts');
    const { makeJpeg } = await import('../../tests/helpers/photos.ts');
    const { sequelize } = await import('../../server/db.ts');
    const { ids } = await seedDemo();
    const basePhotos = await Promise.all(
      pointsInsideField('even', BASE_PHOTOS).map((gps, i) =>
        makeJpeg({
          gps: { ...gps, accuracyM: 4 },
          markSeed: 1000 + i,
          width: 160,
          height: 120,
          dateTimeOriginal: '2026:07:02 10:00:00',
          offsetTimeOriginal: '-05:00',
        }),
      ),
    );
    await sequelize.close();

    server = await startLoadServer(process.env);
    const baseUrl = server.baseUrl;
    const email = (role: string) => demoUsers.find((u) => u.role === role)!.email;
    const adviser = await signInForBench(baseUrl, email('adviser'), DEMO_PASSWORD);
    const scout = await signInForBench(baseUrl, email('scout'), DEMO_PASSWORD);
    const fieldId = ids.fields.patchy;
    const sightingsPath = `/api/sightings?fieldId=${fieldId}`;
    const sightingsAtStart = (await getJson<{ sightings: Array<{ pestId: string }> }>(baseUrl, adviser, sightingsPath)).sightings;
    const pestId = sightingsAtStart[0]?.pestId ?? ids.pests['Soybean aphid'];
    const stored = await postJson<{ check: { id: string; status: string } }>(baseUrl, adviser, '/api/checks', {
      fieldId,
      pestId,
      options: { simulations: 99, seed: 1 },
    });
    if (stored.check.status !== 'done') throw new Error(`the check to read back did not finish inline (status ${stored.check.status})`);

    const readRoutes = [
      { label: 'GET /api/fields', path: '/api/fields' },
      { label: 'GET /api/fields/:id', path: `/api/fields/${fieldId}` },
      { label: 'GET /api/sightings?fieldId=…', path: sightingsPath },
      { label: 'GET /api/checks/:id', path: `/api/checks/${stored.check.id}` },
      { label: 'GET /api/pests', path: '/api/pests' },
    ];
    // Uploads go to another field than the one read: at ~20 placed photos a second the read field's sightings
    // list would otherwise grow tenfold in a minute, and its latency and in-flight memory with it, which is not a leak.
    const form = photoForm(basePhotos, { fieldId: ids.fields.even, pestId, count: '3' });

    const solo = await besideTheFloor(server, [...readRoutes, { label: 'GET /api/config', path: '/api/config' }], {
      cookie: adviser.cookie,
      'accept-encoding': 'gzip',
    });
    const beneath = await beneathTheApp(server, { cookie: adviser.cookie, 'accept-encoding': 'gzip' });
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

    const before = toPoint(0, await server.memory());
    const startedAt = performance.now();
    const sampler = sampleMemoryEvery(server, startedAt);
    const runs = readRoutes.map((route) =>
      start(route.label, {
        connections: READERS_PER_ROUTE,
        headers: { cookie: adviser.cookie, 'accept-encoding': 'gzip' },
        requests: [{ method: 'GET', path: route.path }],
      }),
    );
    const uploads = start('POST /api/photos (1 photo each)', {
      connections: UPLOADERS,
      requests: [
        {
          method: 'POST',
          path: '/api/photos',
          setupRequest: (request) => ({
            ...request,
            headers: { ...request.headers, cookie: scout.cookie, 'x-csrf-token': scout.csrf, 'content-type': form.contentType },
            body: form.next(),
          }),
          onResponse: (status, body) => {
            const outcome = status === 200 ? ((JSON.parse(body) as { results: Array<{ outcome: string }> }).results[0]?.outcome ?? 'none') : `HTTP ${status}`;
            const upload = loads.find((l) => l.label.startsWith('POST'))!;
            upload.outcomes.set(outcome, (upload.outcomes.get(outcome) ?? 0) + 1);
          },
        },
      ],
    });
    await Promise.all([...runs, uploads]);
    await sampler.stop();
    // Requests left in flight at the bell finish first, so this sample is the idle server after the run.
    await sleep(2_000);
    const after = toPoint((performance.now() - startedAt) / 1000, await server.memory());
    const sightingsAtEnd = (await getJson<{ sightings: unknown[] }>(baseUrl, adviser, sightingsPath)).sightings.length;

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
    const totals = loads.reduce(
      (sum, l) => ({
        requests: sum.requests + l.result!.requests.total,
        errors: sum.errors + l.result!.errors,
        timeouts: sum.timeouts + l.result!.timeouts,
        non2xx: sum.non2xx + l.result!.non2xx,
      }),
      { requests: 0, errors: 0, timeouts: 0, non2xx: 0 },
    );
    rows.push({
      route: `all routes, ${seconds} s`,
      clients: READERS_PER_ROUTE * readRoutes.length + UPLOADERS,
      'req/s': fixed(totals.requests / seconds),
      requests: totals.requests,
      errors: totals.errors,
      timeouts: totals.timeouts,
      'non-2xx': totals.non2xx,
    });
    const latency: BenchTable = {
      title: `Load: ${READERS_PER_ROUTE * readRoutes.length} readers and ${UPLOADERS} uploaders for ${seconds} s on loopback (demo data; server in its own process, workers off; uploads go to another field, the read field's sightings list had ${sightingsAtStart.length} rows at the start and ${sightingsAtEnd} at the end)`,
      rows,
    };

    const memoryRow = (label: string, p: SamplePoint) => ({
      sample: label,
      't s': fixed(p.seconds),
      'heap MB': fixed(p.heapMb),
      'external MB': fixed(p.externalMb),
      'of which arrayBuffers MB': fixed(p.arrayBuffersMb),
      'RSS MB': fixed(p.rssMb),
    });
    const memory: BenchTable = {
      title: `Server memory after a forced GC, every ${SAMPLE_EVERY_MS / 1000} s (heap = heapUsed; external includes arrayBuffers)`,
      rows: [memoryRow('idle, before', before), ...sampler.points.map((p) => memoryRow('under load', p)), memoryRow('idle, after', after)],
    };

    const warmedUp = seconds / 2;
    const trends = [
      memoryTrend(sampler.points, 'post-GC heap', (p) => p.heapMb, warmedUp, HEAP_TOLERANCE_MB_PER_MIN),
      memoryTrend(sampler.points, 'external', (p) => p.externalMb, warmedUp, EXTERNAL_TOLERANCE_MB_PER_MIN),
      memoryTrend(sampler.points, 'RSS', (p) => p.rssMb, warmedUp, RSS_TOLERANCE_MB_PER_MIN),
    ];
    // A leak shows as growth; a falling figure (pages handed back, fewer buffers in flight at the last samples) is not one.
    const flat = trends.every((t) => t.verdict === 'flat' || t.verdict === 'falling');
    const verdict: BenchTable = {
      title: `Server memory verdict: ${flat ? 'flat' : 'NOT flat'} (least-squares slope of the under-load samples from ${fixed(warmedUp)} s on)`,
      rows: trends.map((t) => ({
        measure: t.measure,
        samples: t.samples,
        'slope MB/min': Number.isNaN(t.slopeMbPerMin) ? '' : fixed(t.slopeMbPerMin, 2),
        'flat below MB/min': t.toleranceMbPerMin,
        verdict: t.verdict,
      })),
    };
    // The single server's figures are in; its processes make way for the one-versus-two run.
    await server.stop();
    server = null;
    const scaling = await webProcessScaling(
      process.env,
      readRoutes.map((r) => r.path),
      adviser.cookie,
      Math.min(seconds, 20),
    );
    return [solo, beneath, latency, memory, verdict, scaling];
  } finally {
    await server?.stop();
    database.dispose();
  }
}
