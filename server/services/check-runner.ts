// Builds the engine's inputs from the database and runs one stored pattern check through the engine.
// Every figure comes from shared/analysis; this module only reads, hashes and stores.
import crypto from 'node:crypto';
import type { Feature, FeatureCollection, MultiPolygon, Point } from 'geojson';
import { sequelize } from '../db.ts';
import { findFieldBoundary } from '../queries/fields.ts';
import { findCheck, markCheckFailed, markCheckRunning, setRunningCheckProgress, storeCheckResult } from '../queries/pattern-checks.ts';
import { deleteDensityGrid, upsertDensityGrid } from '../queries/pattern-check-density-grids.ts';
import { planSimulations } from '../../shared/analysis/analyse.ts';
import { AnalysisInputError } from '../../shared/analysis/errors.ts';
import type { AnalysisOptions } from '../../shared/analysis/options.ts';
import { createMonteCarloPool, type MonteCarloPool } from './monte-carlo/monte-carlo-pool.ts';
import { BACKGROUND_THREAD_NICE } from './background-priority.ts';
import { closeAnalysisPool, runInAnalysisThread } from './analysis-pool.ts';
import type { SplitResult } from './check-figures.ts';
import { liveSightingsByIds, liveSightingsInWindow, type SightingWindow, type StoredSighting } from '../queries/sightings.ts';

export type { SightingWindow, StoredSighting };

export type SightingProperties = { id: string; count?: number; walk?: string; accuracyM?: number };

/** The live sightings of a pest in a field whose walk falls in the window, empty stops included, by id. */
export async function sightingsInWindow(window: SightingWindow): Promise<StoredSighting[]> {
  return liveSightingsInWindow(window);
}

/** The exact sightings a stored check names, as they are now (deleted or unplaced ones drop out). */
export async function sightingsByIds(ids: string[]): Promise<StoredSighting[]> {
  return liveSightingsByIds(ids);
}

const sha256 = (text: string) => crypto.createHash('sha256').update(text).digest('hex');

/** sha256 over the sorted sightings' id, position, count and last edit, one line each. */
export function sightingsHash(sightings: StoredSighting[]): string {
  const lines = [...sightings].sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0)).map((s) => `${s.id}|${s.lon}|${s.lat}|${s.count ?? ''}|${s.updatedAt}`);
  return sha256(lines.join('\n'));
}

/** JSON with object keys sorted at every level, so equal options always hash alike. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

export const optionsHash = (options: AnalysisOptions) => sha256(canonicalJson(options));

/** The sightings as the engine reads them: a FeatureCollection of Points with id and count (when counted). */
export function sightingsCollection(sightings: StoredSighting[]): FeatureCollection<Point, SightingProperties> {
  return {
    type: 'FeatureCollection',
    features: sightings.map((s): Feature<Point, SightingProperties> => ({
      type: 'Feature',
      geometry: { type: 'Point', coordinates: [s.lon, s.lat] },
      // Walk and GPS accuracy let the engine merge photos of one stop and keep each walk's stops apart.
      properties: {
        id: s.id,
        ...(s.count === null ? {} : { count: s.count }),
        ...(s.walkId ? { walk: s.walkId } : {}),
        ...(s.accuracyM == null ? {} : { accuracyM: s.accuracyM }),
      },
    })),
  };
}

export async function fieldBoundary(fieldId: string): Promise<MultiPolygon> {
  const field = await findFieldBoundary(fieldId);
  if (!field) throw new Error(`Field ${fieldId} no longer exists.`);
  return { type: 'MultiPolygon', coordinates: field.boundary.coordinates };
}

/** Checks up to this much work (simulations × sightings) run inside the request; heavier ones go to the queue. */
export const INLINE_WORK_LIMIT = 200_000;

export const checkWork = (options: AnalysisOptions, sightings: number) => options.simulations * Math.max(sightings, 1);

let pool: MonteCarloPool | null = null;

/** Stops the simulation and analysis threads (tests and shutdown); the next check starts them again. */
export async function closeSimulationPool() {
  const running = pool;
  pool = null;
  await Promise.all([running?.close(), closeAnalysisPool()]);
}

/**
 * Runs the engine on an analysis thread: small checks in one go, heavy ones with their simulations spread over the
 * Monte Carlo threads first (same figures, the engine guarantees it). Progress follows the simulation plans as they
 * finish. Answers the figures and the density grid apart (check-figures.ts).
 */
export async function runAnalysis(
  boundary: MultiPolygon,
  sightings: FeatureCollection<Point, SightingProperties>,
  options: AnalysisOptions,
  onProgress: (share: number) => Promise<void> = async () => {},
): Promise<SplitResult> {
  if (checkWork(options, sightings.features.length) <= INLINE_WORK_LIMIT) return runInAnalysisThread({ kind: 'check', boundary, sightings, options });
  const plans = planSimulations(boundary, sightings, options);
  pool ??= createMonteCarloPool({ niceIncrement: BACKGROUND_THREAD_NICE });
  // Ripley's envelope costs several times the nearest-neighbour simulations, hence the uneven shares. Progress
  // writes are chained, so they reach the row in the order the chunks finished.
  let reported = Promise.resolve();
  const report = (share: number) => {
    reported = reported.then(() => onProgress(share)).catch(() => {});
  };
  const within = (from: number, to: number) => (done: number, total: number) => report(from + ((to - from) * done) / total);
  const nearest = plans.nearestNeighbour ? await pool.run(plans.nearestNeighbour, within(0, 0.25)) : null;
  const ripley = plans.ripley ? await pool.run(plans.ripley, within(0.25, 0.85)) : null;
  await reported;
  const precomputed = { meanNearestDistances: nearest?.meanNearestDistances, ripleyL: ripley?.ripleyL };
  return runInAnalysisThread({ kind: 'check', boundary, sightings, options, precomputed });
}

/** Progress writes are throttled: a check reports at most every 5 %. */
function progressWriter(checkId: string) {
  let last = 0;
  return async (share: number) => {
    if (share - last < 0.05 && share < 1) return;
    last = share;
    await setRunningCheckProgress(checkId, Math.min(0.99, Math.max(0, share)));
  };
}

/** Stores the figures as the thread serialised them (never parsed on this thread) and the density grid beside them. */
async function storeResult(checkId: string, split: SplitResult) {
  await sequelize.transaction(async (transaction) => {
    if (split.densityGrid) {
      const bytes = Buffer.from(split.densityGrid.buffer, split.densityGrid.byteOffset, split.densityGrid.byteLength);
      await upsertDensityGrid(checkId, split.densityGrid.length, bytes, { transaction });
    } else {
      await deleteDensityGrid(checkId, { transaction });
    }
    const { design } = split;
    await storeCheckResult(checkId, split.figuresJson, design, { transaction });
  });
}

/**
 * Runs one stored check (queued or running) to done or failed. Safe to call twice: a finished check is left
 * alone. Returns the engine's input error, if any, so a request can answer it as a 400.
 */
export async function runStoredCheck(checkId: string): Promise<AnalysisInputError | null> {
  const check = await findCheck(checkId);
  if (!check || check.status === 'done' || check.status === 'failed') return null;
  await markCheckRunning(check.id);
  try {
    const sightings = await sightingsByIds(check.sightingIds);
    // The check names an exact set of sightings; if any was edited or removed since, its hash no longer holds.
    if (sightings.length !== check.sightingIds.length || sightingsHash(sightings) !== check.sightingsHash) {
      throw new Error('The sightings changed after this check was queued; run the check again to include the changes.');
    }
    const boundary = await fieldBoundary(check.fieldId);
    const split = await runAnalysis(boundary, sightingsCollection(sightings), check.options as AnalysisOptions, progressWriter(check.id));
    await storeResult(check.id, split);
    return null;
  } catch (error) {
    await markCheckFailed(check.id, (error as Error).message || 'The check failed.');
    return error instanceof AnalysisInputError ? error : null;
  }
}
