// A finished check's density grid, stored apart from its figures (check-figures.ts) and fetched on its own.
import { findDensityGrid } from '../queries/pattern-check-density-grids.ts';
import { findCheckDensityState } from '../queries/pattern-checks.ts';
import type { Actor } from '../auth/passport.ts';
import { AppError, conflict, notFound } from '../errors.ts';
import { densityValues } from './check-figures.ts';

/** The grid's bytes: 64-bit little-endian sightings per ha, row-major from the south, NaN outside the field. */
async function gridBytes(checkId: string): Promise<Buffer | null> {
  const row = await findDensityGrid(checkId);
  if (row?.bytes) return row.bytes;
  if (!row?.legacy) return null;
  // Checks stored before the grid had a table of its own keep it inside their figures.
  const values = JSON.parse(row.legacy) as (number | null)[];
  const grid = Float64Array.from(values, (value) => (value === null ? Number.NaN : value));
  return Buffer.from(grid.buffer);
}

/** The density grid of one of the actor's organisation's finished checks. */
export async function checkDensityGrid(actor: Actor, checkId: string): Promise<Buffer> {
  const check = await findCheckDensityState(actor.organisationId, checkId);
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
