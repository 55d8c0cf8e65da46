import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    CREATE EXTENSION IF NOT EXISTS postgis;

    CREATE TABLE organisations (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      name text NOT NULL CHECK (length(trim(name)) > 0),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE users (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organisation_id uuid NOT NULL REFERENCES organisations(id) ON DELETE CASCADE,
      name text NOT NULL CHECK (length(trim(name)) > 0),
      email text NOT NULL CHECK (email = lower(email) AND position('@' in email) > 1),
      password_hash text,
      role text NOT NULL CHECK (role IN ('admin', 'adviser', 'scout', 'grower')),
      active boolean NOT NULL DEFAULT true,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE UNIQUE INDEX users_email_unique ON users (email);
    CREATE INDEX users_organisation ON users (organisation_id);

    -- One-time links for invitations and password resets; only a hash of the token is kept.
    CREATE TABLE user_tokens (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      purpose text NOT NULL CHECK (purpose IN ('invite', 'reset')),
      token_hash text NOT NULL UNIQUE,
      expires_at timestamptz NOT NULL,
      used_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now()
    );

    CREATE TABLE farms (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organisation_id uuid NOT NULL REFERENCES organisations(id) ON DELETE CASCADE,
      name text NOT NULL CHECK (length(trim(name)) > 0),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (organisation_id, name)
    );

    CREATE TABLE farm_contacts (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      farm_id uuid NOT NULL REFERENCES farms(id) ON DELETE CASCADE,
      name text NOT NULL CHECK (length(trim(name)) > 0),
      email text NOT NULL CHECK (email = lower(email) AND position('@' in email) > 1),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (farm_id, email)
    );

    CREATE TABLE fields (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organisation_id uuid NOT NULL REFERENCES organisations(id) ON DELETE CASCADE,
      farm_id uuid NOT NULL REFERENCES farms(id) ON DELETE CASCADE,
      name text NOT NULL CHECK (length(trim(name)) > 0),
      crop text NOT NULL,
      season integer NOT NULL CHECK (season BETWEEN 1990 AND 2200),
      boundary geometry(MultiPolygon, 4326) NOT NULL CHECK (ST_IsValid(boundary)),
      area_m2 double precision NOT NULL DEFAULT 0,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (farm_id, name, season)
    );
    CREATE INDEX fields_boundary_gist ON fields USING GIST (boundary);
    CREATE INDEX fields_organisation ON fields (organisation_id);

    -- The area is computed by the database on every save, on the WGS 84 ellipsoid.
    CREATE FUNCTION fields_compute_area() RETURNS trigger AS $$
    BEGIN
      NEW.area_m2 := ST_Area(NEW.boundary::geography, true);
      RETURN NEW;
    END $$ LANGUAGE plpgsql;
    CREATE TRIGGER fields_area BEFORE INSERT OR UPDATE OF boundary ON fields
      FOR EACH ROW EXECUTE FUNCTION fields_compute_area();

    CREATE TABLE field_assignments (
      field_id uuid NOT NULL REFERENCES fields(id) ON DELETE CASCADE,
      user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      created_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (field_id, user_id)
    );

    CREATE TABLE farm_growers (
      farm_id uuid NOT NULL REFERENCES farms(id) ON DELETE CASCADE,
      user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
      created_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (farm_id, user_id)
    );

    CREATE TABLE pests (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organisation_id uuid NOT NULL REFERENCES organisations(id) ON DELETE CASCADE,
      name text NOT NULL CHECK (length(trim(name)) > 0),
      kind text NOT NULL CHECK (kind IN ('insect', 'disease', 'weed')),
      count_unit text NOT NULL,
      action_threshold double precision NOT NULL CHECK (action_threshold >= 0),
      threshold_basis text NOT NULL DEFAULT 'mean' CHECK (threshold_basis IN ('mean', 'incidence')),
      threshold_note text NOT NULL DEFAULT '',
      threshold_source text NOT NULL CHECK (length(trim(threshold_source)) > 0),
      active boolean NOT NULL DEFAULT true,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (organisation_id, name)
    );

    CREATE TABLE audit_log (
      id bigserial PRIMARY KEY,
      organisation_id uuid REFERENCES organisations(id) ON DELETE CASCADE,
      user_id uuid REFERENCES users(id) ON DELETE SET NULL,
      action text NOT NULL,
      entity text NOT NULL,
      entity_id text,
      changes jsonb NOT NULL DEFAULT '{}'::jsonb,
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX audit_log_organisation ON audit_log (organisation_id, created_at DESC);

    -- Sessions (connect-pg-simple's table layout).
    CREATE TABLE session (
      sid varchar NOT NULL PRIMARY KEY,
      sess json NOT NULL,
      expire timestamp(6) NOT NULL
    );
    CREATE INDEX session_expire ON session (expire);

    -- Messages kept by the local mail catcher, read on the admin's mailbox page.
    CREATE TABLE mailbox_messages (
      id bigserial PRIMARY KEY,
      envelope_from text,
      envelope_to text[] NOT NULL DEFAULT '{}',
      subject text,
      raw bytea NOT NULL,
      received_at timestamptz NOT NULL DEFAULT now()
    );
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query(`
    DROP TABLE IF EXISTS mailbox_messages, session, audit_log, pests, farm_growers, field_assignments,
      fields, farm_contacts, farms, user_tokens, users, organisations CASCADE;
    DROP FUNCTION IF EXISTS fields_compute_area();
  `);
};
