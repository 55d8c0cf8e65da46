import type { MigrationFn } from '../migrate.ts';

export const up: MigrationFn = async ({ context: db }) => {
  await db.query(`
    -- A check's density grid, kept apart from its figures so reading a check never carries it: 64-bit little-endian
    -- sightings per ha, row-major from the south, NaN outside the field. Checks stored before this keep the grid
    -- inside their figures (result->'density'->'perHa'), and the grid route reads it from there.
    CREATE TABLE pattern_check_density_grids (
      check_id uuid PRIMARY KEY REFERENCES pattern_checks(id) ON DELETE CASCADE,
      cells integer NOT NULL CHECK (cells BETWEEN 1 AND 250000),
      values_f64le bytea NOT NULL CHECK (octet_length(values_f64le) = cells * 8)
    );
  `);
};

export const down: MigrationFn = async ({ context: db }) => {
  await db.query('DROP TABLE IF EXISTS pattern_check_density_grids;');
};
