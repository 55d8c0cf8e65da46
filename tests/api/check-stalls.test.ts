// One request must never stall the others: heavy checks and strips run on analysis threads, options past the
// work budget are refused with a sentence naming the option, and the density grid is served on its own.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { anonymous, signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { makeScoutedField, TEST_FIELD_CORNER, TEST_FIELD_SIZE, type StopPoint } from '../helpers/sightings.ts';
import { fetchDensityGrid } from '../helpers/density-grid.ts';
import { createRandom } from '../../shared/analysis/random.ts';
import { closeSimulationPool, INLINE_WORK_LIMIT } from '../../server/services/check-runner.ts';
import { MAX_STORED_QUADRAT_CELLS } from '../../server/services/check-budget.ts';
import { MAX_FIGURES_BYTES } from '../../server/services/check-figures.ts';

// Invented sightings spread over the test field; nothing here is compared with a published value.
function spreadStops(seed: number, n: number): StopPoint[] {
  const random = createRandom(seed);
  return Array.from({ length: n }, () => ({
    lon: TEST_FIELD_CORNER.lon + TEST_FIELD_SIZE.lon * (0.03 + 0.94 * random()),
    lat: TEST_FIELD_CORNER.lat + TEST_FIELD_SIZE.lat * (0.03 + 0.94 * random()),
    count: Math.floor(random() * 5),
  }));
}

/** 200 Ripley radii from 1 m to 200 m: the most the options allow, and the costliest part of each simulation. */
const manyRadii = Array.from({ length: 200 }, (_, k) => k + 1);
/** 50 radii from 4 m to 200 m: heavy, yet within the inline and sensitivity budgets for 200 sightings. */
const fiftyRadii = Array.from({ length: 50 }, (_, k) => 4 * (k + 1));
const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

let org: TestOrganisation;
let adviser: Client;

beforeAll(async () => {
  org = await makeOrganisation('Stalls');
  adviser = await signedIn(org.users.adviser.email);
});

afterAll(async () => {
  await closeSimulationPool();
});

async function storedChecks(fieldId: string) {
  const [row] = await sequelize.query<{ n: number }>('SELECT count(*)::int AS n FROM pattern_checks WHERE field_id = :fieldId', {
    replacements: { fieldId },
    type: QueryTypes.SELECT,
  });
  return row.n;
}

/** Sends the heavy request, then a trivial one while it runs; answers the order in which they came back. */
async function answerOrder(heavy: () => Promise<{ status: number }>) {
  const order: string[] = [];
  const running = heavy().then((res) => (order.push('heavy'), res));
  await pause(300);
  const visitor = await anonymous();
  const config = await visitor.get('/api/config');
  order.push('config');
  const res = await running;
  return { order, heavyStatus: res.status, configStatus: config.status };
}

describe('heavy requests leave the others answered', () => {
  it('answers GET /api/config while an inline check with 999 simulations and 50 Ripley radii runs', { timeout: 180_000 }, async () => {
    const points = spreadStops(3, 200);
    const { field, pest } = await makeScoutedField(org, points);
    const options = { simulations: 999, seed: 4, radiiM: fiftyRadii };
    // Inline: the request itself waits for the figures.
    expect(options.simulations * points.length).toBeLessThanOrEqual(INLINE_WORK_LIMIT);
    const { order, heavyStatus, configStatus } = await answerOrder(() => adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options }));
    expect(heavyStatus).toBe(201);
    expect(configStatus).toBe(200);
    expect(order).toEqual(['config', 'heavy']);
  });

  it('answers GET /api/config while a sensitivity strip with 50 Ripley radii runs', { timeout: 180_000 }, async () => {
    const { field, pest } = await makeScoutedField(org, spreadStops(5, 200));
    const { order, heavyStatus, configStatus } = await answerOrder(() =>
      adviser.post('/api/checks/sensitivity', { fieldId: field.id, pestId: pest.id, options: { seed: 2, radiiM: fiftyRadii } }),
    );
    expect(heavyStatus).toBe(200);
    expect(configStatus).toBe(200);
    expect(order).toEqual(['config', 'heavy']);
  });
});

describe('the work budget', () => {
  it('refuses simulations past the budget with a sentence naming simulations, and stores nothing', async () => {
    const { field, pest } = await makeScoutedField(org, spreadStops(7, 200));
    const res = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 99_999, radiiM: manyRadii } });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(
      /^Option "simulations": This check would take .* work units, over its budget of .*; reduce "simulations" to at most [\d,]+ or give fewer Ripley radii\.$/,
    );
    expect(res.body.error.fields['options.simulations']).toBeTruthy();
    expect(await storedChecks(field.id)).toBe(0);
  });

  it('refuses a density grid finer than a check may store, naming the smallest cell size to use', async () => {
    const { field, pest } = await makeScoutedField(org, spreadStops(8, 30));
    const res = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 19, densityCellSizeM: 0.5 } });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(
      /^Option "densityCellSizeM": this density grid would have [\d,]+ cells, over the 250,000 a check may store; use a density cell size of at least [\d.]+ m\.$/,
    );
    expect(await storedChecks(field.id)).toBe(0);
  });

  it('refuses a quadrat grid past the stored limit and keeps one at the limit within the size bound', async () => {
    const { field, pest } = await makeScoutedField(org, spreadStops(9, 200));
    const side = Math.floor(Math.sqrt(MAX_STORED_QUADRAT_CELLS));
    const over = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 19, grid: { nx: side + 1, ny: side + 1 } } });
    expect(over.status).toBe(400);
    expect(over.body.error.message).toMatch(/quadrat grid would have about [\d,]+ cells, over the 20,000 a check may store; choose larger quadrat cells/);

    const atLimit = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 19, grid: { nx: side, ny: side } } });
    expect(atLimit.status).toBe(201);
    const [stored] = await sequelize.query<{ bytes: number }>('SELECT octet_length(result::text) AS bytes FROM pattern_checks WHERE id = :id', {
      replacements: { id: atLimit.body.check.id },
      type: QueryTypes.SELECT,
    });
    expect(stored.bytes).toBeGreaterThan(0);
    expect(stored.bytes).toBeLessThanOrEqual(MAX_FIGURES_BYTES);
  });

  it('refuses a sensitivity strip past its budget with a sentence naming the option', async () => {
    const { field, pest } = await makeScoutedField(org, spreadStops(10, 300));
    const res = await adviser.post('/api/checks/sensitivity', { fieldId: field.id, pestId: pest.id, options: { radiiM: manyRadii } });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(
      /^Option "simulations": This sensitivity strip \(nine runs\) would take .* work units, over its budget of .*; reduce "simulations" to at most [\d,]+ or give fewer Ripley radii\.$/,
    );
  });
});

describe('the density grid route', () => {
  it('serves the grid apart from the figures; the grid integrates to the figures’ sighting total', async () => {
    const { field, pest } = await makeScoutedField(org, spreadStops(12, 60));
    const run = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 19, seed: 1 } }).expect(201);
    const read = await adviser.get(`/api/checks/${run.body.check.id}`).expect(200);
    const density = read.body.check.result.density;
    expect(density.perHa).toBeUndefined();

    const { res, values } = await fetchDensityGrid(adviser, run.body.check.id);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/octet-stream/);
    expect(values!.length).toBe(density.cols * density.rows);
    // Σ density × cell area is the engine's own "integratedSightings" figure, stored with the figures.
    const cellHa = (density.cellSizeM * density.cellSizeM) / 10_000;
    const total = values!.reduce((sum, value) => (Number.isNaN(value) ? sum : sum + value * cellHa), 0);
    expect(total).toBeCloseTo(density.integratedSightings, 6);
    expect(Math.max(...values!.filter((v) => !Number.isNaN(v)))).toBeCloseTo(density.maxPerHa, 9);
  });

  it('is not found for another organisation’s adviser', async () => {
    const { field, pest } = await makeScoutedField(org, spreadStops(13, 30));
    const run = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 19 } }).expect(201);
    const other = await makeOrganisation('Stalls elsewhere');
    const stranger = await signedIn(other.users.adviser.email);
    const { res } = await fetchDensityGrid(stranger, run.body.check.id);
    expect(res.status).toBe(404);
  });
});
