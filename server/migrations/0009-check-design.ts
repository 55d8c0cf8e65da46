import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- What a finished check rests on, kept beside the result: its design (stops or whole field), the sightings
    -- it merged into one stop, and the part of the field no stop speaks for ("not scouted", never "clean").
    ALTER TABLE pattern_checks
      ADD COLUMN design text CHECK (design IS NULL OR design IN ('stops', 'whole-field')),
      ADD COLUMN stop_merges jsonb CHECK (stop_merges IS NULL OR jsonb_typeof(stop_merges) = 'array'),
      ADD COLUMN not_scouted geometry(MultiPolygon, 4326),
      ADD COLUMN not_scouted_m2 double precision CHECK (not_scouted_m2 IS NULL OR not_scouted_m2 >= 0);
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query(
    'ALTER TABLE pattern_checks DROP COLUMN IF EXISTS design, DROP COLUMN IF EXISTS stop_merges, DROP COLUMN IF EXISTS not_scouted, DROP COLUMN IF EXISTS not_scouted_m2',
  );
};
