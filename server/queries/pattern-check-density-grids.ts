import { execute, selectRow, type InTransaction } from './sql.ts';

/** Stores (or replaces) a check's grid: 64-bit little-endian values, row-major from the south. */
export const upsertDensityGrid = (checkId: string, cells: number, bytes: Buffer, options: InTransaction = {}) =>
  execute(
    `INSERT INTO pattern_check_density_grids (check_id, cells, values_f64le) VALUES (:checkId, :cells, :bytes)
         ON CONFLICT (check_id) DO UPDATE SET cells = EXCLUDED.cells, values_f64le = EXCLUDED.values_f64le`,
    { checkId, cells, bytes },
    options,
  );

export const deleteDensityGrid = (checkId: string, options: InTransaction = {}) =>
  execute('DELETE FROM pattern_check_density_grids WHERE check_id = :checkId', { checkId }, options);

/** The grid's bytes, or (for a check stored before grids had a table of their own) the JSON list kept in its result. */
export const findDensityGrid = (checkId: string) =>
  selectRow<{ bytes: Buffer | null; legacy: string | null }>(
    `SELECT g.values_f64le AS bytes,
            CASE WHEN g.check_id IS NULL THEN (c.result->'density'->'perHa')::text END AS legacy
       FROM pattern_checks c LEFT JOIN pattern_check_density_grids g ON g.check_id = c.id
      WHERE c.id = :checkId`,
    { checkId },
  );
