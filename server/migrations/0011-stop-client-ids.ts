import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- The phone's own id for a stop recorded offline: sending it twice (a dropped answer, a retry) finds the first.
    ALTER TABLE sightings ADD COLUMN client_id text CHECK (client_id IS NULL OR length(client_id) BETWEEN 1 AND 100);
    CREATE UNIQUE INDEX sightings_one_per_client_id ON sightings (created_by, client_id) WHERE client_id IS NOT NULL;
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query(`
    DROP INDEX IF EXISTS sightings_one_per_client_id;
    ALTER TABLE sightings DROP COLUMN IF EXISTS client_id;
  `);
};
