import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- Whether the admin has checked the action threshold against its published source; until then every screen
    -- that shows it says it needs confirming. Editing the value or the source clears it again.
    ALTER TABLE pests ADD COLUMN threshold_confirmed boolean NOT NULL DEFAULT false;
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query('ALTER TABLE pests DROP COLUMN IF EXISTS threshold_confirmed;');
};
