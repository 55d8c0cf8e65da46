import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- The organisation a caught message was sent for (from the app's own header), so the development mailbox shows
    -- each admin their own organisation's mail and never another's, whoever the recipient is.
    ALTER TABLE mailbox_messages ADD COLUMN organisation_id uuid;
    CREATE INDEX mailbox_messages_organisation ON mailbox_messages (organisation_id, id DESC);
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query('DROP INDEX IF EXISTS mailbox_messages_organisation; ALTER TABLE mailbox_messages DROP COLUMN IF EXISTS organisation_id;');
};
