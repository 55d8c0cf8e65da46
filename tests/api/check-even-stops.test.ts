// A check over 5,000 evenly spread stops: the stops' discs tile the field, so its scouted area has a great many
// corners (some 180,000 in each of its two polygons, measured). It must still store and answer.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { addSightings, makeField, makePest, makeWalk, TEST_FIELD_CORNER, TEST_FIELD_SIZE, type StopPoint } from '../helpers/sightings.ts';
import { fetchCheckPart } from '../helpers/check-parts.ts';
import { MAX_FIGURES_BYTES } from '../../server/services/check-figures.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';

const COLUMNS = 80;
const ROWS = 63;
const STOPS = 5_000;
const WALKS = 4;
/** The review page's budget for a check's answer, plain JSON (not gzip): 200 KB, counted as 200 × 1,000 bytes to be strict. */
const ANSWER_BUDGET_BYTES = 200_000;
/** Few simulations keep a check this size inside the request; the stored sizes do not depend on them. */
const OPTIONS = { simulations: 19, seed: 13 };
/**
 * The served scouted area against PostGIS's own union of the stops' discs, both measured on the spheroid: within 1 %.
 * Both draw circles as polygons (the engine within 1 cm of the arc, PostGIS with 64 sides, about 3 mm here, each a
 * little inside the circle), the engine in its own planar frame, and the served corners are snapped to 1e-6°.
 */
const AREA_TOLERANCE = 0.01;

// Invented stops on an 80 × 63 grid over the test field (about 5.2 m apart each way), row by row until 5,000;
// about one in seven is an empty stop, so the check has a stops design.
function evenStops(): StopPoint[] {
  const points: StopPoint[] = [];
  for (let row = 0; row < ROWS; row++)
    for (let column = 0; column < COLUMNS && points.length < STOPS; column++)
      points.push({
        lon: TEST_FIELD_CORNER.lon + ((column + 0.5) / COLUMNS) * TEST_FIELD_SIZE.lon,
        lat: TEST_FIELD_CORNER.lat + ((row + 0.5) / ROWS) * TEST_FIELD_SIZE.lat,
        count: (3 * column + 5 * row) % 7,
      });
  return points;
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

async function selectOne<T extends object>(sql: string, replacements: Record<string, unknown>) {
  const [row] = await sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });
  return row;
}

let org: TestOrganisation;
let adviser: Client;

beforeAll(async () => {
  org = await makeOrganisation('Even stops');
  adviser = await signedIn(org.users.adviser.email);
});

afterAll(async () => {
  await closeSimulationPool();
});

describe('a check over 5,000 evenly spread stops', () => {
  it('finishes, stores its figures within the bound and answers in under 200 KB, its scouted area as PostGIS draws it', { timeout: 480_000 }, async () => {
    const field = await makeField(org);
    const pest = await makePest(org);
    const points = evenStops();
    for (let w = 0; w < WALKS; w++) {
      const walk = await makeWalk(org, field.id, `2026-07-0${w + 1}`);
      await addSightings(
        org,
        { fieldId: field.id, walkId: walk, pestId: pest.id },
        points.filter((_, i) => i % WALKS === w),
      );
    }

    const run = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: OPTIONS }).expect(201);
    expect(run.body.check.error).toBeNull();
    expect(run.body.check.status).toBe('done');
    const checkId: string = run.body.check.id;

    const stored = await selectOne<{ figuresBytes: number; corners: number }>(
      'SELECT octet_length(result::text) AS "figuresBytes", ST_NPoints(scouted) AS corners FROM pattern_checks WHERE id = :id',
      { id: checkId },
    );
    expect(stored.figuresBytes).toBeLessThanOrEqual(MAX_FIGURES_BYTES);
    // The polygons this is about: tens of thousands of corners, stored in their own column.
    expect(stored.corners).toBeGreaterThan(50_000);

    const answer = await plainBytes(adviser, `/api/checks/${checkId}`).expect(200);
    expect(answer.headers['content-encoding']).toBeUndefined();
    expect((answer.body as Buffer).length).toBeLessThan(ANSWER_BUDGET_BYTES);
    const { check } = JSON.parse((answer.body as Buffer).toString('utf8'));
    expect(check.sightingCount).toBe(STOPS);
    expect(check.design).toBe('stops');
    const radiusM: number = check.result.scouted.radiusM;

    const area = await fetchCheckPart(adviser, checkId, 'scouted-area');
    expect(area.scouted.type).toBe('MultiPolygon');
    // Outside reference: PostGIS buffers each stop by the engine's radius on the spheroid (ST_Buffer on geography works
    // in a suitable UTM zone), unions the discs (GEOS), clips them to the field and measures the union on the spheroid.
    const measured = await selectOne<{ servedM2: number; unionM2: number; fieldM2: number; notScoutedM2: number }>(
      `WITH discs AS (
         SELECT ST_Union(CAST(ST_Buffer(CAST(s.position AS geography), :radius, 'quad_segs=16') AS geometry)) AS g
           FROM sightings s WHERE s.id = ANY(SELECT unnest(sighting_ids) FROM pattern_checks WHERE id = :id)
       ), field AS (SELECT boundary AS g FROM fields WHERE id = :fieldId)
       SELECT ST_Area(CAST(ST_SetSRID(ST_GeomFromGeoJSON(:served), 4326) AS geography)) AS "servedM2",
              ST_Area(CAST(ST_Intersection(discs.g, field.g) AS geography)) AS "unionM2",
              ST_Area(CAST(field.g AS geography)) AS "fieldM2",
              ST_Area(CAST(ST_SetSRID(ST_GeomFromGeoJSON(:notScouted), 4326) AS geography)) AS "notScoutedM2"
         FROM discs, field`,
      { id: checkId, fieldId: field.id, radius: radiusM, served: JSON.stringify(area.scouted), notScouted: JSON.stringify(area.notScouted) },
    );
    expect(measured.unionM2).toBeGreaterThan(0.5 * measured.fieldM2);
    expect(Math.abs(measured.servedM2 / measured.unionM2 - 1)).toBeLessThan(AREA_TOLERANCE);
    // The rest of the field, not scouted: the field less PostGIS's union, within the same share of the field.
    expect(Math.abs(measured.notScoutedM2 - (measured.fieldM2 - measured.unionM2)) / measured.fieldM2).toBeLessThan(AREA_TOLERANCE);
    // The figures' own scouted area is measured on the engine's unsnapped polygons: the same within the same tolerance.
    expect(Math.abs(check.result.scouted.scoutedM2 / measured.unionM2 - 1)).toBeLessThan(AREA_TOLERANCE);
  });
});
