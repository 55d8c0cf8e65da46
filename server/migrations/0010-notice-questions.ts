import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- A grower's question or comment on a notice (through their copy's link or signed in), and the adviser's answer.
    CREATE TABLE notice_questions (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      notice_id uuid NOT NULL REFERENCES notices(id) ON DELETE CASCADE,
      recipient_id uuid REFERENCES notice_recipients(id) ON DELETE SET NULL,
      asked_by uuid REFERENCES users(id) ON DELETE SET NULL,
      asker_name text NOT NULL CHECK (length(trim(asker_name)) > 0),
      asker_email text NOT NULL CHECK (asker_email = lower(asker_email) AND position('@' in asker_email) > 1),
      body text NOT NULL CHECK (length(body) BETWEEN 1 AND 2000),
      adviser_mailed_at timestamptz,
      answer text CHECK (answer IS NULL OR length(answer) BETWEEN 1 AND 2000),
      answered_by uuid REFERENCES users(id) ON DELETE SET NULL,
      answered_at timestamptz,
      grower_mailed_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CHECK ((answer IS NULL) = (answered_at IS NULL)),
      CHECK (grower_mailed_at IS NULL OR answered_at IS NOT NULL)
    );
    CREATE INDEX notice_questions_notice ON notice_questions (notice_id, created_at);
    CREATE INDEX notice_questions_waiting ON notice_questions (notice_id) WHERE answered_at IS NULL;
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query(`DROP TABLE IF EXISTS notice_questions;`);
};
