// A finished check's density grid, stored apart from its figures (check-figures.ts) and fetched on its own.
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import type { Actor } from '../auth/passport.ts';
import { AppError, conflict, notFound } from '../errors.ts';
import { densityValues } from './check-figures.ts';

/** The grid's bytes: 64-bit little-endian sightings per ha, row-major from the south, NaN outside the field. */
async function gridBytes(checkId: string): Promise<Buffer | null> {
  const [row] = await sequelize.query<{ bytes: Buffer | null; legacy: string | null }>(
    `SELECT g.values_f64le AS bytes,
            CASE WHEN g.check_id IS NULL THEN (c.result->'density'->'perHa')::text END AS legacy
       FROM pattern_checks c LEFT JOIN pattern_check_density_grids g ON g.check_id = c.id
      WHERE c.id = :checkId`,
    { replacements: { checkId }, type: QueryTypes.SELECT },
  );
  if (row?.bytes) return row.bytes;
  if (!row?.legacy) return null;
  // Checks stored before the grid had a table of its own keep it inside their figures.
  const values = JSON.parse(row.legacy) as (number | null)[];
  const grid = Float64Array.from(values, (value) => (value === null ? Number.NaN : value));
  return Buffer.from(grid.buffer);
}

/** The density grid of one of the actor's organisation's finished checks. */
export async function checkDensityGrid(actor: Actor, checkId: string): Promise<Buffer> {
  const [check] = await sequelize.query<{ status: string; hasDensity: boolean }>(
    `SELECT status, (result->'density') IS NOT NULL AND jsonb_typeof(result->'density') = 'object' AS "hasDensity"
       FROM pattern_checks WHERE id = :checkId AND organisation_id = :org`,
    { replacements: { checkId, org: actor.organisationId }, type: QueryTypes.SELECT },
  );
  if (!check) throw notFound('That pattern check');
  if (check.status !== 'done') throw conflict('This check has not finished yet; its density surface comes with its result.');
  const bytes = check.hasDensity ? await gridBytes(checkId) : null;
  if (!bytes) throw new AppError(404, 'not_found', 'This check has no density surface: none of its sightings lies inside the field.');
  return bytes;
}

/** The stored density surface as the engine's perHa list, for the zone proposals that re-threshold it. */
export async function storedDensityValues(checkId: string): Promise<(number | null)[] | null> {
  const bytes = await gridBytes(checkId);
  if (!bytes) return null;
  return densityValues(new Float64Array(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength)));
}
