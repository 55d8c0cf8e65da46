import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- One analysis run over a set of sightings (field × pest × date window), stored with everything needed
    -- to reproduce it: the options after defaults, the exact sightings (ids and a hash of their content)
    -- and the engine version.
    CREATE TABLE pattern_checks (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organisation_id uuid NOT NULL REFERENCES organisations(id) ON DELETE CASCADE,
      field_id uuid NOT NULL REFERENCES fields(id) ON DELETE CASCADE,
      pest_id uuid NOT NULL REFERENCES pests(id) ON DELETE CASCADE,
      window_from date,
      window_to date,
      options jsonb NOT NULL,
      options_hash text NOT NULL CHECK (options_hash ~ '^[0-9a-f]{64}$'),
      sighting_ids uuid[] NOT NULL,
      sightings_hash text NOT NULL CHECK (sightings_hash ~ '^[0-9a-f]{64}$'),
      engine_version text NOT NULL,
      status text NOT NULL DEFAULT 'queued' CHECK (status IN ('queued', 'running', 'done', 'failed')),
      progress double precision NOT NULL DEFAULT 0 CHECK (progress BETWEEN 0 AND 1),
      result jsonb,
      error text,
      created_by uuid NOT NULL REFERENCES users(id),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      finished_at timestamptz,
      CHECK (window_from IS NULL OR window_to IS NULL OR window_from <= window_to),
      CHECK ((status = 'done') = (result IS NOT NULL)),
      CHECK (status <> 'failed' OR error IS NOT NULL)
    );
    -- A repeat with the same inputs finds the stored check instead of computing again.
    CREATE UNIQUE INDEX pattern_checks_same_inputs ON pattern_checks
      (field_id, pest_id, window_from, window_to, options_hash, sightings_hash, engine_version) NULLS NOT DISTINCT;
    CREATE INDEX pattern_checks_field ON pattern_checks (field_id, pest_id, created_at DESC);
    CREATE INDEX pattern_checks_organisation ON pattern_checks (organisation_id, created_at DESC);
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query('DROP TABLE IF EXISTS pattern_checks CASCADE');
};
