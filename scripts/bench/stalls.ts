// Event-loop stalls: the longest the API's event loop went unanswered (perf_hooks monitorEventLoopDelay, 10 ms
// resolution) while the heaviest allowed request of each kind ran, beside a trivial request's stall in the same run.
// The server runs in this process, so the histogram is the server's own loop. Prints a table; asserts nothing.
import { monitorEventLoopDelay } from 'node:perf_hooks';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { area as turfArea, circle as turfCircle } from '@turf/turf';
import type { Polygon } from 'geojson';
import { startThrowawayDatabase } from './lib/throwaway-database.ts';
import { signInForBench, type BenchSession } from './lib/bench-session.ts';
import type { BenchTable } from './table.ts';

const GOAL_MS = 100;
const READ_SIGHTINGS = 5_000;

const ms = (value: number) => (value >= 1000 ? `${(value / 1000).toFixed(2)} s` : `${value.toFixed(0)} ms`);

/** Runs one request and answers its wall time and the longest event-loop stall seen while it ran. */
async function measured(request: () => Promise<Response>) {
  const histogram = monitorEventLoopDelay({ resolution: 10 });
  histogram.enable();
  const started = performance.now();
  const res = await request();
  const bytes = (await res.arrayBuffer()).byteLength;
  const wallMs = performance.now() - started;
  histogram.disable();
  return { status: res.status, bytes, wallMs, stallMs: histogram.max / 1e6 };
}

export async function run(): Promise<BenchTable> {
  const database = await startThrowawayDatabase('stalls');
  let server: Server | null = null;
  let cleanUp: () => Promise<void> = async () => {};
  try {
    const { makeOrganisation, TEST_PASSWORD } = await import('../../tests/helpers/org.ts');
    const { addSightings, makeField, makePest, makeWalk, TEST_FIELD_CORNER, TEST_FIELD_SIZE } = await import('../../tests/helpers/sightings.ts');
    const { createRandom } = await import('../../shared/analysis/random.ts');
    const { createApp } = await import('../../server/app.ts');
    const { sequelize } = await import('../../server/db.ts');
    const { closeSimulationPool, INLINE_WORK_LIMIT } = await import('../../server/services/check-runner.ts');
    const { MAX_BOUNDARY_CORNERS } = await import('../../shared/boundary/validate-boundary.ts');
    const { CHECK_WORK_BUDGET, INLINE_WORK_UNITS, SENSITIVITY_WORK_BUDGET, MAX_STORED_QUADRAT_CELLS, estimateWork, fieldExtent } =
      await import('../../server/services/check-budget.ts');
    const { analysisOptionsSchema } = await import('../../shared/analysis/options.ts');
    const extentOf = (polygon: Polygon) => fieldExtent({ type: 'MultiPolygon', coordinates: [polygon.coordinates] }, turfArea(polygon));
    cleanUp = async () => {
      await closeSimulationPool();
      await sequelize.close();
    };

    const org = await makeOrganisation('Stall bench');
    const random = createRandom('stall-bench');
    const scouted = async (n: number) => {
      const field = await makeField(org);
      const pest = await makePest(org);
      const walkId = await makeWalk(org, field.id);
      const stops = Array.from({ length: n }, () => ({
        lon: TEST_FIELD_CORNER.lon + TEST_FIELD_SIZE.lon * (0.02 + 0.96 * random()),
        lat: TEST_FIELD_CORNER.lat + TEST_FIELD_SIZE.lat * (0.02 + 0.96 * random()),
        count: Math.floor(random() * 5),
      }));
      await addSightings(org, { fieldId: field.id, walkId, pestId: pest.id }, stops);
      return { field, pest };
    };

    const app = createApp();
    server = await new Promise<Server>((resolve) => {
      const s = app.listen(0, '127.0.0.1', () => resolve(s));
    });
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const adviser = await signInForBench(base, org.users.adviser.email, TEST_PASSWORD);
    const admin = await signInForBench(base, org.users.admin.email, TEST_PASSWORD);
    const get = (path: string, session: BenchSession) => fetch(`${base}${path}`, { headers: { cookie: session.cookie, 'accept-encoding': 'identity' } });
    const post = (path: string, session: BenchSession, body: unknown) =>
      fetch(`${base}${path}`, {
        method: 'POST',
        headers: { cookie: session.cookie, 'x-csrf-token': session.csrf, 'content-type': 'application/json' },
        body: JSON.stringify(body),
      });

    // Threads start and compile once; the first request of each kind would measure that, not the request.
    const warm = await scouted(30);
    await post('/api/checks/sensitivity', adviser, { fieldId: warm.field.id, pestId: warm.pest.id });
    // The reference: trivial requests one after another for 3 s, so the histogram has as many samples as a heavy request's.
    const reference = await measured(async () => {
      const until = performance.now() + 3000;
      let last = await fetch(`${base}/api/config`);
      while (performance.now() < until) {
        await last.arrayBuffer();
        last = await fetch(`${base}/api/config`);
      }
      return last;
    });

    const rows: BenchTable['rows'] = [];
    const add = (request: string, result: Awaited<ReturnType<typeof measured>>, note: string) =>
      rows.push({
        request,
        status: result.status,
        'longest stall': ms(result.stallMs),
        'reference (GET /api/config for 3 s)': ms(reference.stallMs),
        goal: result.stallMs < GOAL_MS ? `under ${GOAL_MS} ms` : `OVER ${GOAL_MS} ms`,
        'wall time': ms(result.wallMs),
        note,
      });

    const farmId = ((await (await post('/api/farms', admin, { name: 'Stall bench farm' })).json()) as { farm: { id: string } }).farm.id;
    const boundary = turfCircle([TEST_FIELD_CORNER.lon, TEST_FIELD_CORNER.lat], 0.4, { steps: MAX_BOUNDARY_CORNERS }).geometry;
    add(
      'Boundary upload at the corner limit',
      await measured(() => post('/api/fields', admin, { farmId, name: 'Round field', crop: 'maize', season: 2026, boundary })),
      `${MAX_BOUNDARY_CORNERS.toLocaleString('en')} corners (turf circle)`,
    );

    const inline = await scouted(200);
    // 50 radii out to 200 m keep 999 simulations of 200 sightings just within the inline budget.
    const radiiM = Array.from({ length: 50 }, (_, k) => 4 * (k + 1));
    const side = Math.floor(Math.sqrt(MAX_STORED_QUADRAT_CELLS));
    const inlineOptions = { simulations: Math.floor(INLINE_WORK_LIMIT / 200) - 1, seed: 1, radiiM, grid: { nx: side, ny: side }, densityCellSizeM: 1 };
    const inlineWork = estimateWork(analysisOptionsSchema.parse(inlineOptions), 200, extentOf(inline.field.boundary)).total;
    add(
      'Inline check, heaviest inline options',
      await measured(() => post('/api/checks', adviser, { fieldId: inline.field.id, pestId: inline.pest.id, options: inlineOptions })),
      `200 sightings, ${inlineOptions.simulations} simulations, 50 radii, ${side}×${side} quadrats, 1 m density cells; ${inlineWork.toExponential(1)} of the ${INLINE_WORK_UNITS.toExponential(1)} inline units (${CHECK_WORK_BUDGET.toExponential(1)} queued)`,
    );

    const strip = await scouted(200);
    const stripOptions = { seed: 1, radiiM };
    const stripWork = 9 * estimateWork(analysisOptionsSchema.parse({ ...stripOptions, simulations: 199 }), 200, extentOf(strip.field.boundary), 0.5).total;
    add(
      'Sensitivity strip',
      await measured(() => post('/api/checks/sensitivity', adviser, { fieldId: strip.field.id, pestId: strip.pest.id, options: stripOptions })),
      `200 sightings, 199 simulations, 50 radii, nine runs; ${stripWork.toExponential(1)} of ${SENSITIVITY_WORK_BUDGET.toExponential(1)} units`,
    );

    const big = await scouted(READ_SIGHTINGS);
    // Few simulations keep it inline: what is measured is the read, and the figures' size does not depend on them.
    const bigOptions = { simulations: 9, seed: 1 };
    const stored = (await (await post('/api/checks', adviser, { fieldId: big.field.id, pestId: big.pest.id, options: bigOptions })).json()) as {
      check: { id: string; status: string };
    };
    if (stored.check?.status !== 'done') throw new Error(`The ${READ_SIGHTINGS}-sighting check did not finish inline.`);
    const firstRead = await measured(() => get(`/api/checks/${stored.check.id}`, adviser));
    add(
      'Reading a stored big check (first read)',
      firstRead,
      `${READ_SIGHTINGS.toLocaleString('en')} sightings, ${(firstRead.bytes / 1024).toFixed(0)} KB of figures`,
    );
    const grid = await measured(() => get(`/api/checks/${stored.check.id}/density`, adviser));
    add('Its density grid', grid, `${(grid.bytes / 1024).toFixed(0)} KB, fetched only when the density layer opens`);

    return { title: 'Event-loop stalls while one heavy request runs (monitorEventLoopDelay, in-process server, loopback)', rows };
  } finally {
    if (server) {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server!.close(() => resolve()));
    }
    await cleanUp().catch(() => {});
    database.dispose();
  }
}
