import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- The page order of a field's walks (day, creation time, id, newest first) and of its checks (creation time, id,
    -- newest first), so each page is read in index order from the cursor on instead of sorting the whole field.
    CREATE INDEX walks_field_page ON walks (field_id, walked_on DESC, created_at DESC, id DESC);
    CREATE INDEX pattern_checks_field_page ON pattern_checks (field_id, created_at DESC, id DESC);
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query('DROP INDEX IF EXISTS walks_field_page, pattern_checks_field_page;');
};
