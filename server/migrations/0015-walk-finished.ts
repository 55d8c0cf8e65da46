import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- When the scout (or a desk user) finished the walk; the first finish is kept, a second one changes nothing.
    ALTER TABLE walks ADD COLUMN finished_at timestamptz;
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query('ALTER TABLE walks DROP COLUMN IF EXISTS finished_at;');
};
