import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- What a notice said when it went out (figures, zones, boundary, sightings, words): the page, map and e-mail
    -- retries read it, so later edits to the field, its sightings or zones do not change a sent notice.
    -- Nullable: drafts read live data, and notices sent before this column have no snapshot to give.
    ALTER TABLE notices ADD COLUMN material jsonb CHECK (material IS NULL OR jsonb_typeof(material) = 'object');
    ALTER TABLE notices ADD CONSTRAINT notices_draft_has_no_snapshot CHECK (status <> 'draft' OR material IS NULL);
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query(`ALTER TABLE notices DROP COLUMN IF EXISTS material;`);
};
