import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- How the organisation's dates are written (a BCP 47 language tag) and in which IANA time zone; the API checks both against Intl.
    ALTER TABLE organisations
      ADD COLUMN locale text NOT NULL DEFAULT 'en-GB' CHECK (locale ~ '^[A-Za-z0-9-]{2,35}$'),
      ADD COLUMN time_zone text NOT NULL DEFAULT 'Europe/London' CHECK (time_zone ~ '^[A-Za-z0-9_+/-]{1,64}$');
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query('ALTER TABLE organisations DROP COLUMN IF EXISTS time_zone, DROP COLUMN IF EXISTS locale;');
};
