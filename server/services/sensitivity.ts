// The sensitivity strip: the engine's verdict across several quadrat cell sizes and area bases, with fewer
// simulations so it answers quickly. Every figure is read from analyse(); nothing is recomputed here.
import type { Actor } from '../auth/passport.ts';
import { badRequest } from '../errors.ts';
import { findVisibleField } from './fields.ts';
import { findPest } from './pests.ts';
import { fieldBoundary, sightingsCollection, sightingsInWindow } from './check-runner.ts';
import { analyse, type AnalysisResult } from '../../shared/analysis/analyse.ts';
import { AnalysisInputError } from '../../shared/analysis/errors.ts';
import type { AnalysisOptions } from '../../shared/analysis/options.ts';
import { SENSITIVITY_SIMULATIONS, type CheckRequest, type SensitivityResponse, type SensitivityRow } from '../../shared/schemas/checks.ts';

export const CELL_SIZE_FACTORS = [0.5, 1, 2] as const;
export const SENSITIVITY_AREA_BASES = ['boundary', 'bbox', 'hull'] as const;

function row(result: AnalysisResult, cellSizeFactor: number, areaBasis: SensitivityRow['areaBasis']): SensitivityRow {
  const nearest = result.nearestNeighbour;
  return {
    cellSizeM: result.quadrat?.cellSizeM ?? null,
    cellSizeFactor,
    areaBasis,
    verdict: result.spread.verdict,
    R: nearest?.R ?? null,
    z: nearest?.z ?? null,
    pValue: nearest?.pValue ?? null,
    donnellyR: nearest?.donnelly.R ?? null,
    monteCarloPValue: nearest?.monteCarlo.pValue ?? null,
    chiSquare: result.quadrat?.chiSquare ?? null,
    quadratPValue: result.quadrat?.pValue ?? null,
  };
}

/**
 * Runs the check at 0.5×, 1× and 2× the default (or chosen) cell side, on the boundary, bounding-rectangle
 * and hull areas. The adviser's own simulations count is capped at the quick default.
 */
export async function sensitivityStrip(actor: Actor, request: CheckRequest): Promise<SensitivityResponse> {
  if (request.options.planar) throw badRequest('Option planar: stored sightings are longitude/latitude, so a field check cannot use planar coordinates.');
  await findVisibleField(actor, request.fieldId);
  await findPest(actor, request.pestId);
  const sightings = sightingsCollection(await sightingsInWindow(request));
  const boundary = await fieldBoundary(request.fieldId);
  const simulations = Math.min(request.options.simulations, SENSITIVITY_SIMULATIONS);
  const base: AnalysisOptions = { ...request.options, simulations, grid: undefined, customAreaM2: undefined };
  const run = (options: AnalysisOptions) => {
    try {
      return analyse(boundary, sightings, options);
    } catch (error) {
      if (error instanceof AnalysisInputError) return error;
      throw error;
    }
  };
  const failedRow = (error: AnalysisInputError, cellSizeFactor: number, areaBasis: SensitivityRow['areaBasis']): SensitivityRow => ({
    cellSizeM: null, cellSizeFactor, areaBasis, verdict: null, R: null, z: null, pValue: null, donnellyR: null, monteCarloPValue: null, chiSquare: null, quadratPValue: null, error: error.message,
  });

  const rows: SensitivityRow[] = [];
  // The 1× side is the engine's own default (or the adviser's chosen side) on the field boundary.
  const reference = run({ ...base, areaBasis: 'boundary' });
  if (reference instanceof AnalysisInputError) throw badRequest(reference.message);
  const side = reference.quadrat?.cellSizeM ?? null;
  for (const areaBasis of SENSITIVITY_AREA_BASES) {
    for (const factor of CELL_SIZE_FACTORS) {
      if (areaBasis === 'boundary' && factor === 1) {
        rows.push(row(reference, factor, areaBasis));
        continue;
      }
      const result = run({ ...base, areaBasis, cellSizeM: side === null ? undefined : side * factor });
      rows.push(result instanceof AnalysisInputError ? failedRow(result, factor, areaBasis) : row(result, factor, areaBasis));
    }
  }
  return { simulations, rows };
}
