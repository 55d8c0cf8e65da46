import type { MultiPolygon } from 'geojson';
import { boundaryValidity } from '../queries/postgis.ts';
import { fault } from '../../shared/boundary/boundary-faults.ts';
import { refuseDeepNesting } from '../../shared/boundary/collection-depth.ts';
import { runInAnalysisThread } from './analysis-pool.ts';

// Faults the sweep-line crossing check cannot see, found by PostGIS: a hole outside its shell, parts that overlap, and the like.
function postgisFault({ reason, x, y }: { reason: string | null; x: number | null; y: number | null }) {
  const near = x !== null && y !== null ? ` near (${x.toFixed(6)}, ${y.toFixed(6)})` : '';
  if (/hole lies outside shell/i.test(reason ?? '')) {
    return fault(
      'hole-outside-shell',
      `A hole in the boundary lies outside its outer ring${near}; a hole must sit inside the outline, so remove it or redraw it inside.`,
    );
  }
  return fault(
    'self-intersecting',
    `The boundary is not a valid polygon (${reason ?? 'unknown reason'}${near}); check that holes lie inside the outline and parts do not overlap.`,
  );
}

/** Reads a boundary from a GeoJSON value or a file's text and checks it, on an analysis thread and then in PostGIS. */
export async function readBoundary(input: { boundary?: unknown; boundaryFile?: string }): Promise<MultiPolygon> {
  // A parsed body is checked here, before it is copied to the thread; a file's text is checked where the thread parses it.
  if (input.boundaryFile === undefined && input.boundary !== undefined) refuseDeepNesting(input.boundary);
  const { boundary } = await runInAnalysisThread({ kind: 'boundary', input: { boundary: input.boundary, boundaryFile: input.boundaryFile } });
  const check = await boundaryValidity(boundary);
  if (!check.valid) throw postgisFault(check);
  return boundary;
}
