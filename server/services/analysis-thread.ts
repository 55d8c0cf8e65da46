// The body of an analysis thread: every engine run and boundary check of the server happens here, never on the
// thread that answers requests. Answers are plain data; engine and boundary errors come back as values, since an
// Error's class does not survive the trip between threads.
import type { FeatureCollection, MultiPolygon, Point } from 'geojson';
import { analyse, type PrecomputedSimulations, type StopsSummary } from '../../shared/analysis/analyse.ts';
import type { CoverageResult } from '../../shared/analysis/coverage.ts';
import { AnalysisInputError } from '../../shared/analysis/errors.ts';
import type { AnalysisOptions } from '../../shared/analysis/options.ts';
import { DOMParser } from '@xmldom/xmldom';
import { boundaryFromGeoJson, parseBoundaryText } from '../../shared/boundary/parse-boundary.ts';
import { validateBoundary } from '../../shared/boundary/validate-boundary.ts';
import { BoundaryError, type BoundaryFault } from '../../shared/boundary/boundary-faults.ts';
import type { SensitivityRow } from '../../shared/schemas/checks.ts';
import { oversizeMessage, splitResult, type SplitResult } from './check-figures.ts';
import { sensitivityRows } from './sensitivity-strip.ts';

export type AnalysisTask =
  | { kind: 'boundary'; input: BoundaryInput }
  | { kind: 'check'; boundary: MultiPolygon; sightings: FeatureCollection<Point>; options: AnalysisOptions; precomputed?: PrecomputedSimulations }
  | { kind: 'sensitivity'; boundary: MultiPolygon; sightings: FeatureCollection<Point>; options: AnalysisOptions }
  | { kind: 'walk-coverage'; boundary: MultiPolygon; sightings: FeatureCollection<Point> };

export type AnalysisAnswer =
  | { kind: 'boundary'; boundary: MultiPolygon; areaM2: number }
  | ({ kind: 'check' } & SplitResult)
  | { kind: 'sensitivity'; rows: SensitivityRow[] }
  | { kind: 'walk-coverage'; stops: StopsSummary; coverage: CoverageResult | null }
  | { kind: 'input-error'; message: string }
  | { kind: 'boundary-fault'; fault: BoundaryFault };

export interface BoundaryInput {
  boundary?: unknown;
  boundaryFile?: string;
}

/** Reads a boundary from a GeoJSON value or a file's text and checks it; longitude and latitude only are kept. */
function readBoundary(input: BoundaryInput): { boundary: MultiPolygon; areaM2: number } {
  let boundary: MultiPolygon;
  if (input.boundaryFile !== undefined) boundary = parseBoundaryText(input.boundaryFile, DOMParser as never);
  else if (input.boundary !== undefined) boundary = boundaryFromGeoJson(input.boundary);
  else throw new BoundaryError({ code: 'not-polygon', message: 'Add a boundary: upload a GeoJSON or KML file, or draw it on the map.' });
  // Checked before anything walks the coordinates, so a badly nested file gets a message rather than a crash.
  const { areaM2 } = validateBoundary(boundary);
  // Heights in a KML file are not part of a field's outline.
  return { boundary: { type: 'MultiPolygon', coordinates: boundary.coordinates.map((p) => p.map((r) => r.map(([x, y]) => [x, y]))) }, areaM2 };
}

function runTask(task: AnalysisTask): AnalysisAnswer {
  if (task.kind === 'boundary') return { kind: 'boundary', ...readBoundary(task.input) };
  if (task.kind === 'walk-coverage') {
    // The engine's own stop merging and coverage rules; no simulations, since only the walk's figures are wanted.
    const result = analyse(task.boundary, task.sightings, { simulations: 0 });
    return { kind: 'walk-coverage', stops: result.stops, coverage: result.coverage };
  }
  if (task.kind === 'sensitivity') return { kind: 'sensitivity', rows: sensitivityRows(task.boundary, task.sightings, task.options) };
  const result = analyse(task.boundary, task.sightings, task.options, task.precomputed);
  const split = splitResult(result);
  const oversize = oversizeMessage(result, split.figuresBytes);
  if (oversize) return { kind: 'input-error', message: oversize };
  return { kind: 'check', ...split };
}

export function runAnalysisTask(task: AnalysisTask): AnalysisAnswer {
  try {
    return runTask(task);
  } catch (error) {
    if (error instanceof AnalysisInputError) return { kind: 'input-error', message: error.message };
    if (error instanceof BoundaryError) return { kind: 'boundary-fault', fault: error.fault };
    throw error;
  }
}
