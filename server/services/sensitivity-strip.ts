// The sensitivity strip's nine runs: the engine's verdict across quadrat cell sizes and area bases. Pure CPU work,
// run on an analysis thread; every figure is read from analyse(), nothing is recomputed here.
import type { MultiPolygon, FeatureCollection, Point } from 'geojson';
import { analyse, type AnalysisResult } from '../../shared/analysis/analyse.ts';
import { AnalysisInputError } from '../../shared/analysis/errors.ts';
import type { AnalysisOptions } from '../../shared/analysis/options.ts';
import type { SensitivityRow } from '../../shared/schemas/checks.ts';

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

const failedRow = (error: AnalysisInputError, cellSizeFactor: number, areaBasis: SensitivityRow['areaBasis']): SensitivityRow => ({
  cellSizeM: null,
  cellSizeFactor,
  areaBasis,
  verdict: null,
  R: null,
  z: null,
  pValue: null,
  donnellyR: null,
  monteCarloPValue: null,
  chiSquare: null,
  quadratPValue: null,
  error: error.message,
});

/**
 * Runs the check at 0.5×, 1× and 2× the default (or chosen) cell side, on the boundary, bounding-rectangle and hull
 * areas. Throws the reference run's input error (the adviser's to fix); a variant's own error fills its row.
 */
export function sensitivityRows(boundary: MultiPolygon, sightings: FeatureCollection<Point>, base: AnalysisOptions): SensitivityRow[] {
  const run = (options: AnalysisOptions) => {
    try {
      return analyse(boundary, sightings, options);
    } catch (error) {
      if (error instanceof AnalysisInputError) return error;
      throw error;
    }
  };
  const rows: SensitivityRow[] = [];
  // The 1× side is the engine's own default (or the adviser's chosen side) on the field boundary.
  const reference = run({ ...base, areaBasis: 'boundary' });
  if (reference instanceof AnalysisInputError) throw reference;
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
  return rows;
}
