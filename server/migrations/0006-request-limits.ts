import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- Counts for the sign-in and password-reset limits, shared by every app process and kept over restarts.
    CREATE TABLE request_limit_hits (
      key text PRIMARY KEY,
      hits integer NOT NULL CHECK (hits >= 0),
      resets_at timestamptz NOT NULL
    );
    CREATE INDEX request_limit_hits_resets_at ON request_limit_hits (resets_at);
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query('DROP TABLE IF EXISTS request_limit_hits;');
};
