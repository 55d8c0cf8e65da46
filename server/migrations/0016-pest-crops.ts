import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- The crops a pest belongs to, so the scout's and the adviser's pest lists can put the field's crop first.
    -- Names as the admin writes them; they are matched to a field's crop without regard to case.
    ALTER TABLE pests
      ADD COLUMN crops text[] NOT NULL DEFAULT '{}'
        CHECK (array_position(crops, NULL) IS NULL AND cardinality(crops) <= 40);
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query('ALTER TABLE pests DROP COLUMN IF EXISTS crops;');
};
