import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { addSightings, makeField, makePest, makeWalk, TEST_FIELD_CORNER, TEST_FIELD_SIZE, type StopPoint } from '../helpers/sightings.ts';
import { expectServedAsComputed, fetchCheckPart, withCheckParts } from '../helpers/check-parts.ts';
import { analyse } from '../../shared/analysis/analyse.ts';
import { createRandom } from '../../shared/analysis/random.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';

const SIGHTINGS = 5_000;
const WALKS = 4;
/** The review page's budget for a check's answer, plain JSON (not gzip): 200 KB, counted as 200 × 1,000 bytes to be strict. */
const ANSWER_BUDGET_BYTES = 200_000;
/** Few simulations keep a check this size inside the request; the answer's size does not depend on them. */
const OPTIONS = { simulations: 19, seed: 13 };

// Invented sightings: a deterministic pattern of twelve loose patches with a fifth of the stops empty, spread at
// random over the test field, so the check has a stops design and every per-stop part is as large as 5,000 stops make it.
function patchyStops(seed: string): StopPoint[] {
  const random = createRandom(seed);
  const centres = Array.from({ length: 12 }, () => [0.1 + 0.8 * random(), 0.1 + 0.8 * random()]);
  return Array.from({ length: SIGHTINGS }, (_, i) => {
    const empty = i % 5 === 0;
    const [cx, cy] = empty ? [random(), random()] : centres[i % centres.length];
    const spread = empty ? 0 : 0.06;
    const x = Math.min(0.999, Math.max(0.001, cx + spread * (random() - 0.5)));
    const y = Math.min(0.999, Math.max(0.001, cy + spread * (random() - 0.5)));
    return {
      lon: TEST_FIELD_CORNER.lon + x * TEST_FIELD_SIZE.lon,
      lat: TEST_FIELD_CORNER.lat + y * TEST_FIELD_SIZE.lat,
      count: empty ? 0 : 1 + Math.round(20 * random()),
    };
  });
}

const plainBytes = (client: Client, url: string) =>
  client
    .get(url)
    .set('Accept-Encoding', 'identity')
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });

let org: TestOrganisation;
let adviser: Client;

beforeAll(async () => {
  org = await makeOrganisation('Answer size');
  adviser = await signedIn(org.users.adviser.email);
});

afterAll(async () => {
  await closeSimulationPool();
});

describe('a check over 5,000 sightings', () => {
  it('answers in under 200 KB of plain JSON, its per-stop figures, cells and scouted area on routes of their own', { timeout: 240_000 }, async () => {
    const field = await makeField(org);
    const pest = await makePest(org);
    const points = patchyStops('answer-size');
    const inserted: Array<{ id: string; point: StopPoint; walk: string }> = [];
    for (let w = 0; w < WALKS; w++) {
      const walk = await makeWalk(org, field.id, `2026-07-0${w + 1}`);
      const own = points.filter((_, i) => i % WALKS === w);
      const ids = await addSightings(org, { fieldId: field.id, walkId: walk, pestId: pest.id }, own);
      ids.forEach((id, k) => inserted.push({ id, point: own[k], walk }));
    }

    const run = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: OPTIONS }).expect(201);
    expect(run.body.check.status).toBe('done');
    const checkId: string = run.body.check.id;

    const answer = await plainBytes(adviser, `/api/checks/${checkId}`).expect(200);
    expect(answer.headers['content-encoding']).toBeUndefined();
    const bytes = answer.body as Buffer;
    expect(bytes.length).toBeLessThan(ANSWER_BUDGET_BYTES);
    const { check } = JSON.parse(bytes.toString('utf8'));
    expect(check.sightingCount).toBe(SIGHTINGS);
    expect((await fetchCheckPart(adviser, checkId, 'sighting-ids')).sightingIds).toHaveLength(SIGHTINGS);
    // The map's layer fetches only the not-scouted part: the same polygons as in the whole scouted area, in fewer bytes.
    const area = await plainBytes(adviser, `/api/checks/${checkId}/scouted-area`).expect(200);
    const notScouted = await plainBytes(adviser, `/api/checks/${checkId}/not-scouted-area`).expect(200);
    const parse = (res: { body: Buffer }) => JSON.parse(res.body.toString('utf8'));
    expect(parse(notScouted)).toEqual({ notScouted: parse(area).notScouted });
    expect((notScouted.body as Buffer).length).toBeLessThan((area.body as Buffer).length);

    // Consistency check, not an outside reference: the answer with its parts put back must be exactly what the
    // engine returns for the same sightings and options, so moving the parts out lost or changed nothing.
    // (The engine's figures themselves are held against R and turf in tests/analysis.)
    const byId = [...inserted].sort((a, b) => (a.id < b.id ? -1 : 1));
    const reference = analyse(
      field.boundary,
      {
        type: 'FeatureCollection',
        features: byId.map(({ id, point, walk }) => ({
          type: 'Feature' as const,
          geometry: { type: 'Point' as const, coordinates: [point.lon, point.lat] },
          properties: { id, count: point.count as number, walk },
        })),
      },
      { ...OPTIONS, zones: { actionThreshold: 2, unit: 'aphids per plant' } },
    );
    const { timingsMs: _served, ...served } = (await withCheckParts(adviser, check)) as Record<string, unknown>;
    const { timingsMs: _computed, ...computed } = JSON.parse(JSON.stringify(reference));
    await expectServedAsComputed(served, computed);
  });
});
