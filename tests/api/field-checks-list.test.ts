// GET /api/fields/:id/checks: a field's past checks as summary rows, for the review page's list and its comparison.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mean } from 'simple-statistics';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { addSightings, makePest, makeScoutedField, makeWalk, TEST_FIELD_CORNER, TEST_FIELD_SIZE, type StopPoint } from '../helpers/sightings.ts';
import { createRandom } from '../../shared/analysis/random.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';

// Invented sightings: one tight patch of found stops among empty stops laid on a grid across the field.
function patchWithEmptyStops(seed: number, found: number): StopPoint[] {
  const random = createRandom(seed);
  const patch = Array.from({ length: found }, () => ({
    lon: TEST_FIELD_CORNER.lon + TEST_FIELD_SIZE.lon * (0.25 + (random() - 0.5) * 0.06),
    lat: TEST_FIELD_CORNER.lat + TEST_FIELD_SIZE.lat * (0.3 + (random() - 0.5) * 0.06),
    count: 2 + Math.floor(random() * 5),
  }));
  const empty = Array.from({ length: 24 }, (_, k) => ({
    lon: TEST_FIELD_CORNER.lon + (TEST_FIELD_SIZE.lon * ((k % 6) + 0.5)) / 6,
    lat: TEST_FIELD_CORNER.lat + (TEST_FIELD_SIZE.lat * (Math.floor(k / 6) + 0.5)) / 4,
    count: 0,
  }));
  return [...patch, ...empty];
}

interface Summary {
  id: string;
  pestId: string;
  from: string | null;
  to: string | null;
  verdict: string | null;
  n: number | null;
  sightings: number;
  walkDates: string[];
  options: { simulations: number; seed?: number };
  figures: Record<string, number | null>;
  threshold: { meanPerStop: number | null; actionThreshold: number; countUnit: string };
  result?: unknown;
}

let org: TestOrganisation;
let adviser: Client;

beforeAll(async () => {
  org = await makeOrganisation('Check list');
  adviser = await signedIn(org.users.adviser.email);
});

afterAll(async () => {
  await stopQueue();
  await closeSimulationPool();
});

describe('a field’s list of checks', () => {
  it('lists the newest check first, each with its window, walks, options and the figures its own answer holds', async () => {
    const first = patchWithEmptyStops(301, 14);
    const { field, pest } = await makeScoutedField(org, first, { walkedOn: '2026-06-10', pest: { actionThreshold: 1.5 } });
    const laterWalk = await makeWalk(org, field.id, '2026-06-24');
    const later = patchWithEmptyStops(302, 9);
    await addSightings(org, { fieldId: field.id, walkId: laterWalk, pestId: pest.id }, later);

    const older = (
      await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, to: '2026-06-15', options: { simulations: 99, seed: 3 } }).expect(201)
    ).body.check;
    const newer = (await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 99, seed: 4 } }).expect(201)).body.check;

    const res = await adviser.get(`/api/fields/${field.id}/checks`).expect(200);
    const rows = res.body.checks as Summary[];
    expect(rows.map((c) => c.id)).toEqual([newer.id, older.id]);
    expect(rows[0].result).toBeUndefined();

    const [newest, oldest] = rows;
    expect(oldest).toMatchObject({ from: null, to: '2026-06-15', sightings: first.length, walkDates: ['2026-06-10'], options: { simulations: 99, seed: 3 } });
    expect(newest).toMatchObject({ from: null, to: null, sightings: first.length + later.length, walkDates: ['2026-06-10', '2026-06-24'] });

    // The figures are the ones GET /api/checks/:id answers for the same check.
    for (const [row, posted] of [
      [newest, newer],
      [oldest, older],
    ] as const) {
      const { check } = (await adviser.get(`/api/checks/${posted.id}`).expect(200)).body;
      const result = check.result;
      expect(row.verdict).toBe(result.spread.verdict);
      expect(row.n).toBe(result.n);
      expect(row.figures.stops).toBe(result.stops.count);
      expect(row.figures.emptyStops).toBe(result.stops.empty);
      expect(row.figures.clarkEvansR).toBeCloseTo(result.nearestNeighbour.R, 12);
      expect(row.figures.donnellyR).toBeCloseTo(result.nearestNeighbour.donnelly.R, 12);
      expect(row.figures.moranI).toBeCloseTo(result.counts.moran.I, 12);
      expect(row.figures.zoneCount).toBe(result.zones.features.length);
      const zonesM2 = result.zones.features.reduce((sum: number, z: { properties: { areaM2: number } }) => sum + z.properties.areaM2, 0);
      if (result.zones.features.length > 0) expect(row.figures.zonesM2).toBeCloseTo(zonesM2, 6);
      else expect(row.figures.zonesM2).toBeNull();
    }

    // Mean count per stop, empty stops as 0, recomputed from the counts inserted (simple-statistics).
    expect(oldest.threshold.meanPerStop).toBeCloseTo(mean(first.map((p) => p.count as number)), 10);
    expect(newest.threshold.meanPerStop).toBeCloseTo(mean([...first, ...later].map((p) => p.count as number)), 10);
    expect(newest.threshold).toMatchObject({ actionThreshold: 1.5, countUnit: 'aphids per plant' });
  });

  it('lists only the chosen pest’s checks when asked', async () => {
    const { field, pest } = await makeScoutedField(org, patchWithEmptyStops(311, 8));
    const other = await makePest(org);
    const walk = await makeWalk(org, field.id, '2026-07-02');
    await addSightings(org, { fieldId: field.id, walkId: walk, pestId: other.id }, patchWithEmptyStops(312, 8));
    const mine = (await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 19 } }).expect(201)).body.check;
    const theirs = (await adviser.post('/api/checks', { fieldId: field.id, pestId: other.id, options: { simulations: 19 } }).expect(201)).body.check;

    const all = (await adviser.get(`/api/fields/${field.id}/checks`).expect(200)).body.checks as Summary[];
    expect(all.map((c) => c.id)).toEqual([theirs.id, mine.id]);
    const one = (await adviser.get(`/api/fields/${field.id}/checks?pestId=${pest.id}`).expect(200)).body.checks as Summary[];
    expect(one.map((c) => c.id)).toEqual([mine.id]);
  });

  it('gives another organisation nothing, and refuses scouts and growers', async () => {
    const { field, pest } = await makeScoutedField(org, patchWithEmptyStops(321, 8));
    await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 19 } }).expect(201);

    const other = await makeOrganisation('Check list other');
    for (const role of ['adviser', 'admin'] as const) {
      const outsider = await signedIn(other.users[role].email);
      const res = await outsider.get(`/api/fields/${field.id}/checks`);
      expect(res.status).toBe(404);
      expect(res.body.checks).toBeUndefined();
    }
    for (const role of ['scout', 'grower'] as const) {
      const client = await signedIn(org.users[role].email);
      expect((await client.get(`/api/fields/${field.id}/checks`)).status).toBe(403);
    }
    const admin = await signedIn(org.users.admin.email);
    expect(((await admin.get(`/api/fields/${field.id}/checks`).expect(200)).body.checks as Summary[]).length).toBe(1);
  });

  it('refuses a field id that is not an id, saying so', async () => {
    const res = await adviser.get('/api/fields/not-a-field/checks').expect(400);
    expect(res.body.error.message).toMatch(/field id is not valid/i);
  });
});
