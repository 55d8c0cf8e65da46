import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- A copy sent to an address the adviser added for one notice only, not to one of the farm's contacts.
    ALTER TABLE notice_recipients ADD COLUMN added_for_notice boolean NOT NULL DEFAULT false;
    -- The adviser's list of notices pages through the organisation by the notice's date (sent, or written for a draft).
    CREATE INDEX notices_organisation_dated ON notices (organisation_id, (COALESCE(sent_at, created_at)) DESC, id DESC);
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query('DROP INDEX IF EXISTS notices_organisation_dated; ALTER TABLE notice_recipients DROP COLUMN IF EXISTS added_for_notice;');
};
