// Migration 0018 moves the scouted-area polygons of checks stored before it out of their figures into the
// geometry column, and back on the way down, losing no corner either way.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { makeScoutedField, TEST_FIELD_CORNER, TEST_FIELD_SIZE, type StopPoint } from '../helpers/sightings.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';
import { down, up } from '../../server/migrations/0018-check-scouted-area.ts';

const migration = { context: { query: (sql: string) => sequelize.query(sql) } };

// Invented stops: a 9 × 7 grid over the test field, every fourth one empty, so the check has a stops design.
const gridStops: StopPoint[] = Array.from({ length: 63 }, (_, k) => ({
  lon: TEST_FIELD_CORNER.lon + (((k % 9) + 0.5) / 9) * TEST_FIELD_SIZE.lon,
  lat: TEST_FIELD_CORNER.lat + ((Math.floor(k / 9) + 0.5) / 7) * TEST_FIELD_SIZE.lat,
  count: k % 4 === 0 ? 0 : 1 + (k % 6),
}));

interface StoredRow {
  scouted: string | null;
  notScouted: string | null;
  inFigures: boolean;
}

const stored = async (id: string, withColumn = true) =>
  (
    await sequelize.query<StoredRow>(
      `SELECT ${withColumn ? 'ST_AsGeoJSON(scouted, 9)' : 'NULL'} AS scouted, ST_AsGeoJSON(not_scouted, 9) AS "notScouted",
              (result #> '{scouted,scouted}') IS NOT NULL AS "inFigures" FROM pattern_checks WHERE id = :id`,
      { replacements: { id }, type: QueryTypes.SELECT },
    )
  )[0];

let org: TestOrganisation;
let adviser: Client;

beforeAll(async () => {
  org = await makeOrganisation('Scouted area migration');
  adviser = await signedIn(org.users.adviser.email);
});

afterAll(async () => {
  await closeSimulationPool();
});

describe('migration 0018', () => {
  it('puts a check’s polygons back in its figures on the way down and into the column on the way up, corner for corner', async () => {
    const { field, pest } = await makeScoutedField(org, gridStops);
    const run = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 19 } }).expect(201);
    const id: string = run.body.check.id;
    const before = await stored(id);
    expect(JSON.parse(before.scouted!).type).toBe('MultiPolygon');
    expect(before.inFigures).toBe(false);

    await down(migration);
    try {
      // As a check stored before the migration: polygons in the figures, no column.
      const [columns] = await sequelize.query<{ n: number }>(
        `SELECT count(*)::int AS n FROM information_schema.columns WHERE table_name = 'pattern_checks' AND column_name = 'scouted'`,
        { type: QueryTypes.SELECT },
      );
      expect(columns.n).toBe(0);
      expect((await stored(id, false)).inFigures).toBe(true);
    } finally {
      await up(migration);
    }

    const after = await stored(id);
    expect(after.inFigures).toBe(false);
    // The same corners before and after, written by PostGIS to 1e-9° (0.1 mm): the way down writes GeoJSON, whose
    // decimals need not give back the very same 64-bit numbers.
    expect(after.scouted).toBe(before.scouted);
    expect(after.notScouted).toBe(before.notScouted);
  });
});
