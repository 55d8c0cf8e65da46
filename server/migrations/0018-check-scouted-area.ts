import type { MigrationFn } from '../migrate.ts';

// A check over thousands of evenly spread stops has a scouted area of hundreds of thousands of corners, several MB
// as JSON: it moves out of the figures into a geometry column beside not_scouted, and the figures keep the scalars.
const polygons = (key: string) => `(result #> '{scouted,${key}}')`;
const coordinates = (key: string) => `(result #> '{scouted,${key},coordinates}')`;
const hasPolygons = (key: string) =>
  `jsonb_typeof(${polygons(key)}) = 'object' AND jsonb_typeof(${coordinates(key)}) = 'array' AND jsonb_array_length(${coordinates(key)}) > 0`;

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- Where the stops speak for the crop (longitude/latitude), NULL without stops.
    ALTER TABLE pattern_checks ADD COLUMN scouted geometry(MultiPolygon, 4326);
    UPDATE pattern_checks SET scouted = ST_Multi(ST_SetSRID(ST_GeomFromGeoJSON(CAST(${polygons('scouted')} AS text)), 4326)) WHERE ${hasPolygons('scouted')};
    UPDATE pattern_checks SET result = jsonb_set(result, '{scouted}', (result->'scouted') - 'scouted' - 'notScouted')
     WHERE jsonb_typeof(result->'scouted') = 'object';
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  const asJson = (column: string) => `coalesce(ST_AsGeoJSON(${column})::jsonb, '{"type":"MultiPolygon","coordinates":[]}'::jsonb)`;
  await db.query(`
    UPDATE pattern_checks SET result = jsonb_set(result, '{scouted}', (result->'scouted')
             || jsonb_build_object('scouted', ${asJson('scouted')}, 'notScouted', ${asJson('not_scouted')}))
     WHERE jsonb_typeof(result->'scouted') = 'object';
    ALTER TABLE pattern_checks DROP COLUMN IF EXISTS scouted;
  `);
};
