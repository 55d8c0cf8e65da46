import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- A walk is one visit to one field on one day by one scout: uploads find it instead of making a second.
    CREATE UNIQUE INDEX walks_one_per_scout_field_day ON walks (field_id, scout_id, walked_on);
    CREATE INDEX walks_scout ON walks (scout_id, walked_on);

    CREATE INDEX sightings_walk ON sightings (walk_id) WHERE deleted_at IS NULL;
    CREATE INDEX sightings_deleted ON sightings (deleted_at) WHERE deleted_at IS NOT NULL;
    CREATE INDEX sightings_photo ON sightings (photo_id);

    -- Why a thumbnail could not be made, for the adviser (the sighting keeps its position and time).
    ALTER TABLE photos ADD COLUMN thumbnail_error text;
    CREATE UNIQUE INDEX photos_thumbnail_key ON photos (thumbnail_key) WHERE thumbnail_key IS NOT NULL;
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query(`
    DROP INDEX IF EXISTS photos_thumbnail_key;
    ALTER TABLE photos DROP COLUMN IF EXISTS thumbnail_error;
    DROP INDEX IF EXISTS sightings_photo, sightings_deleted, sightings_walk, walks_scout, walks_one_per_scout_field_day;
  `);
};
