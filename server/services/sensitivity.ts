// The sensitivity strip: the engine's verdict across several quadrat cell sizes and area bases, with fewer
// simulations so it answers quickly. The nine runs happen on an analysis thread (sensitivity-strip.ts).
import type { Actor } from '../auth/passport.ts';
import { badRequest } from '../errors.ts';
import { findVisibleField } from './fields.ts';
import { findPest } from './pests.ts';
import { fieldBoundary, sightingsCollection, sightingsInWindow } from './check-runner.ts';
import { runInAnalysisThread } from './analysis-pool.ts';
import { assertSensitivityWithinBudget, fieldExtent } from './check-budget.ts';
import { AnalysisInputError } from '../../shared/analysis/errors.ts';
import type { AnalysisOptions } from '../../shared/analysis/options.ts';
import { SENSITIVITY_SIMULATIONS, type CheckRequest, type SensitivityResponse } from '../../shared/schemas/checks.ts';

export { CELL_SIZE_FACTORS, SENSITIVITY_AREA_BASES } from './sensitivity-strip.ts';

/**
 * Runs the check at 0.5×, 1× and 2× the default (or chosen) cell side, on the boundary, bounding-rectangle
 * and hull areas. The adviser's own simulations count is capped at the quick default.
 */
export async function sensitivityStrip(actor: Actor, request: CheckRequest): Promise<SensitivityResponse> {
  if (request.options.planar) throw badRequest('Option planar: stored sightings are longitude/latitude, so a field check cannot use planar coordinates.');
  const field = await findVisibleField(actor, request.fieldId);
  await findPest(actor, request.pestId);
  const stored = await sightingsInWindow(request);
  const simulations = Math.min(request.options.simulations, SENSITIVITY_SIMULATIONS);
  const options: AnalysisOptions = { ...request.options, simulations, grid: undefined, customAreaM2: undefined };
  assertSensitivityWithinBudget(options, stored.length, fieldExtent(field.boundary, field.areaM2));
  const boundary = await fieldBoundary(request.fieldId);
  try {
    const { rows } = await runInAnalysisThread({ kind: 'sensitivity', boundary, sightings: sightingsCollection(stored), options });
    return { simulations, rows };
  } catch (error) {
    if (error instanceof AnalysisInputError) throw badRequest(error.message);
    throw error;
  }
}
