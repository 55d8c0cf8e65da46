// The summary a scout sees when finishing a walk: stops, found and empty, the route walked and how evenly the
// field was covered. Route length and spacing are checked against turf and textbook formulas on the same points.
import { afterAll, describe, expect, it } from 'vitest';
import { area, distance, length, lineString, polygon } from '@turf/turf';
import { signedIn } from '../helpers/http.ts';
import { addUser, makeOrganisation } from '../helpers/org.ts';
import { degreeRectangle } from '../helpers/boundary-shapes.ts';
import { insideField, makeJpeg, scoutingSetUp, SOUTH_WEST_ORIGIN, uploadPhotos } from '../helpers/photos.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';

afterAll(async () => {
  await closeSimulationPool();
  await stopQueue();
});

// Six stops at least 90 m apart (far beyond the 5 m same-stop radius), made in this order in time.
const route = [
  { kind: 'photo', at: '08:00', ...insideField(0.1, 0.1), count: 2 },
  { kind: 'stop', at: '08:05', ...insideField(0.3, 0.2) },
  { kind: 'photo', at: '08:10', ...insideField(0.5, 0.4), count: 1 },
  { kind: 'stop', at: '08:15', ...insideField(0.7, 0.5) },
  { kind: 'stop', at: '08:20', ...insideField(0.8, 0.8) },
  { kind: 'photo', at: '08:25', ...insideField(0.4, 0.9), count: 4 },
] as const;

/** Haversine great-circle distance on a sphere of radius 6 371 008.8 m (the IUGG mean Earth radius, from memory). */
function haversineM(a: { lon: number; lat: number }, b: { lon: number; lat: number }) {
  const rad = Math.PI / 180;
  const h = Math.sin(((b.lat - a.lat) * rad) / 2) ** 2 + Math.cos(a.lat * rad) * Math.cos(b.lat * rad) * Math.sin(((b.lon - a.lon) * rad) / 2) ** 2;
  return 2 * 6_371_008.8 * Math.asin(Math.sqrt(h));
}

async function walkedField() {
  const setUp = await scoutingSetUp();
  const walk = (await setUp.scout.post('/api/walks', { fieldId: setUp.field.id, walkedOn: '2026-11-21' }).expect(201)).body.walk;
  const photos = route.filter((r) => r.kind === 'photo');
  // Photos first and stops after, so the order they reach the server is not the order they were made.
  await uploadPhotos(
    setUp.scout,
    await Promise.all(
      photos.map(async (p, i) => ({
        bytes: await makeJpeg({ gps: { lon: p.lon, lat: p.lat }, dateTimeOriginal: `2026:11:21 ${p.at}:00`, offsetTimeOriginal: '-03:00', markSeed: 80 + i }),
      })),
    ),
    { pestId: setUp.pest.id, walkId: walk.id, counts: JSON.stringify(photos.map((p) => p.count)) },
  ).expect(200);
  for (const stop of route.filter((r) => r.kind === 'stop')) {
    await setUp.scout
      .post(`/api/walks/${walk.id}/stops`, { pestId: setUp.pest.id, lon: stop.lon, lat: stop.lat, accuracyM: 5, observedAt: `2026-11-21T${stop.at}:00-03:00` })
      .expect(201);
  }
  return { ...setUp, walkId: walk.id as string };
}

describe('walk summary', () => {
  it('counts stops, found and empty, and measures the route stop to stop in time order', async () => {
    const { scout, walkId } = await walkedField();
    const { summary } = (await scout.get(`/api/walks/${walkId}/summary`).expect(200)).body;
    expect(summary).toMatchObject({ walkId, sightings: 6, stops: 6, found: 3, empty: 3 });

    const points = route.map((r) => [r.lon, r.lat]);
    // turf `length` over the same points, in the order they were made.
    expect(summary.routeLengthM).toBeCloseTo(length(lineString(points), { units: 'meters' }), 6);
    // Haversine on the same sphere agrees to well under a metre.
    const haversine = route.slice(1).reduce((sum, r, i) => sum + haversineM(route[i], r), 0);
    expect(Math.abs(summary.routeLengthM - haversine)).toBeLessThan(0.5);
  });

  it('reports the spacing of the stops as Clark–Evans R against the field area', async () => {
    const { scout, walkId } = await walkedField();
    const { summary } = (await scout.get(`/api/walks/${walkId}/summary`).expect(200)).body;
    const field = degreeRectangle(SOUTH_WEST_ORIGIN.lon, SOUTH_WEST_ORIGIN.lat, 0.01, 0.01);
    const areaM2 = area(polygon(field.coordinates));
    const nearest = route.map((a) => Math.min(...route.filter((b) => b !== a).map((b) => distance([a.lon, a.lat], [b.lon, b.lat], { units: 'meters' }))));
    const meanNearest = nearest.reduce((s, d) => s + d, 0) / nearest.length;
    // Clark & Evans (1954): R = mean nearest-neighbour distance ÷ 0.5·√(A/n). The engine measures in UTM metres,
    // turf on the sphere; over a kilometre the two differ by well under 1 %.
    const expectedR = meanNearest / (0.5 * Math.sqrt(areaM2 / route.length));
    expect(summary.coverage.stopsR).toBeGreaterThan(expectedR * 0.99);
    expect(summary.coverage.stopsR).toBeLessThan(expectedR * 1.01);
    expect(summary.evenness).toMatch(/^The stops reached \d+ % of the field's \d+ m squares, against about \d+ %/);
  });

  it('says too few stops to judge the coverage of a walk with fewer than four', async () => {
    const { scout, field, pest } = await scoutingSetUp();
    const walk = (await scout.post('/api/walks', { fieldId: field.id, walkedOn: '2026-11-22' }).expect(201)).body.walk;
    const empty = (await scout.get(`/api/walks/${walk.id}/summary`).expect(200)).body.summary;
    expect(empty).toMatchObject({ sightings: 0, stops: 0, found: 0, empty: 0, routeLengthM: 0, coverage: null });
    await scout.post(`/api/walks/${walk.id}/stops`, { pestId: pest.id, ...insideField(0.5, 0.5), accuracyM: 5 }).expect(201);
    const one = (await scout.get(`/api/walks/${walk.id}/summary`).expect(200)).body.summary;
    expect(one).toMatchObject({ stops: 1, empty: 1, routeLengthM: 0, coverage: null });
    expect(one.evenness).toMatch(/at least four/);
  });

  it('shows a walk only to its scout and the desk roles of the organisation', async () => {
    const { org, admin, walkId } = await walkedField();
    await admin.get(`/api/walks/${walkId}/summary`).expect(200);
    await (await signedIn(org.users.adviser.email)).get(`/api/walks/${walkId}/summary`).expect(200);
    const otherScout = await addUser(org, 'scout');
    const fieldId = (await admin.get(`/api/walks/${walkId}`).expect(200)).body.walk.fieldId;
    await admin.post(`/api/fields/${fieldId}/scouts`, { userId: otherScout.id }).expect(204);
    expect((await (await signedIn(otherScout.email)).get(`/api/walks/${walkId}/summary`)).status).toBe(403);
    expect((await (await signedIn(org.users.grower.email)).get(`/api/walks/${walkId}/summary`)).status).toBe(403);
    const stranger = await makeOrganisation('Elsewhere');
    expect((await (await signedIn(stranger.users.admin.email)).get(`/api/walks/${walkId}/summary`)).status).toBe(404);
  });
});
