import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- One accepted (or draft) set of treatment zones for a field and pest; each acceptance is a new version.
    CREATE TABLE zone_sets (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organisation_id uuid NOT NULL REFERENCES organisations(id) ON DELETE CASCADE,
      field_id uuid NOT NULL REFERENCES fields(id) ON DELETE CASCADE,
      check_id uuid REFERENCES pattern_checks(id) ON DELETE SET NULL,
      pest_id uuid NOT NULL REFERENCES pests(id) ON DELETE CASCADE,
      version integer NOT NULL CHECK (version >= 1),
      status text NOT NULL DEFAULT 'draft' CHECK (status IN ('draft', 'accepted', 'superseded')),
      created_by uuid NOT NULL REFERENCES users(id),
      accepted_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (field_id, pest_id, version),
      CHECK (status = 'draft' OR accepted_at IS NOT NULL)
    );
    -- At most one accepted set per field and pest at any time.
    CREATE UNIQUE INDEX zone_sets_one_accepted ON zone_sets (field_id, pest_id) WHERE status = 'accepted';
    CREATE INDEX zone_sets_organisation ON zone_sets (organisation_id, created_at DESC);

    CREATE TABLE zones (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      zone_set_id uuid NOT NULL REFERENCES zone_sets(id) ON DELETE CASCADE,
      position integer NOT NULL CHECK (position >= 1),
      label text NOT NULL CHECK (length(trim(label)) > 0),
      geometry geometry(MultiPolygon, 4326) NOT NULL CHECK (ST_IsValid(geometry)),
      area_m2 double precision NOT NULL DEFAULT 0,
      share_of_field double precision NOT NULL CHECK (share_of_field >= 0 AND share_of_field <= 1.000001),
      sightings_inside integer NOT NULL DEFAULT 0 CHECK (sightings_inside >= 0),
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (zone_set_id, position)
    );
    CREATE INDEX zones_geometry_gist ON zones USING GIST (geometry);

    -- Like a field's area: computed by the database on every save, on the WGS 84 ellipsoid.
    CREATE FUNCTION zones_compute_area() RETURNS trigger AS $$
    BEGIN
      NEW.area_m2 := ST_Area(NEW.geometry::geography, true);
      RETURN NEW;
    END $$ LANGUAGE plpgsql;
    CREATE TRIGGER zones_area BEFORE INSERT OR UPDATE OF geometry ON zones
      FOR EACH ROW EXECUTE FUNCTION zones_compute_area();

    -- The message to the grower about one zone set.
    CREATE TABLE notices (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      organisation_id uuid NOT NULL REFERENCES organisations(id) ON DELETE CASCADE,
      field_id uuid NOT NULL REFERENCES fields(id) ON DELETE CASCADE,
      zone_set_id uuid NOT NULL REFERENCES zone_sets(id) ON DELETE RESTRICT,
      check_id uuid REFERENCES pattern_checks(id) ON DELETE SET NULL,
      pest_id uuid NOT NULL REFERENCES pests(id) ON DELETE CASCADE,
      recommendation text NOT NULL CHECK (length(trim(recommendation)) > 0),
      rescout_on date,
      status text NOT NULL DEFAULT 'draft' CHECK (status IN ('draft', 'sending', 'sent', 'partly-failed')),
      created_by uuid NOT NULL REFERENCES users(id),
      sent_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CHECK (status = 'draft' OR sent_at IS NOT NULL)
    );
    CREATE INDEX notices_organisation ON notices (organisation_id, created_at DESC);
    CREATE INDEX notices_field ON notices (field_id, created_at DESC);

    -- One grower contact's copy of a notice: its delivery, its link (only a hash of the token) and its reading.
    CREATE TABLE notice_recipients (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      notice_id uuid NOT NULL REFERENCES notices(id) ON DELETE CASCADE,
      contact_name text NOT NULL,
      email text NOT NULL CHECK (email = lower(email) AND position('@' in email) > 1),
      token_hash text UNIQUE CHECK (token_hash IS NULL OR token_hash ~ '^[0-9a-f]{64}$'),
      token_expires_at timestamptz,
      revoked_at timestamptz,
      status text NOT NULL DEFAULT 'queued' CHECK (status IN ('queued', 'sending', 'sent', 'failed')),
      attempts integer NOT NULL DEFAULT 0 CHECK (attempts >= 0),
      last_error text,
      message_id text NOT NULL UNIQUE,
      smtp_accepted_at timestamptz,
      opened_at timestamptz,
      acknowledged_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      UNIQUE (notice_id, email),
      CHECK ((status = 'sent') = (smtp_accepted_at IS NOT NULL)),
      CHECK (status <> 'failed' OR last_error IS NOT NULL),
      CHECK (acknowledged_at IS NULL OR opened_at IS NOT NULL)
    );
    CREATE INDEX notice_recipients_notice ON notice_recipients (notice_id);
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query(`
    DROP TABLE IF EXISTS notice_recipients, notices, zones, zone_sets CASCADE;
    DROP FUNCTION IF EXISTS zones_compute_area();
  `);
};
