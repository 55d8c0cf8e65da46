import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- How long a field may go unscouted for a pest before it needs another walk, where that figure comes from,
    -- and whether the admin has checked it (a common-practice default stays unconfirmed until they do).
    ALTER TABLE pests
      ADD COLUMN rescout_days integer NOT NULL DEFAULT 7 CHECK (rescout_days BETWEEN 1 AND 365),
      ADD COLUMN rescout_source text NOT NULL DEFAULT 'Weekly scouting, common practice; confirm for your region',
      ADD COLUMN rescout_confirmed boolean NOT NULL DEFAULT false;
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query(`ALTER TABLE pests DROP COLUMN IF EXISTS rescout_days, DROP COLUMN IF EXISTS rescout_source, DROP COLUMN IF EXISTS rescout_confirmed;`);
};
