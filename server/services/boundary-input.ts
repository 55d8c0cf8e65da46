import type { MultiPolygon } from 'geojson';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import { fault } from '../../shared/boundary/boundary-faults.ts';
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

// A field's outline needs a Feature in a FeatureCollection at most, or a GeometryCollection of polygons; a few more
// levels cost nothing, but thousands would exhaust the parser's stack and take the request down with them.
const MAX_COLLECTION_DEPTH = 16;

/** How deeply GeoJSON collections nest in a value, counted without recursion (so any depth is safe to measure). */
function collectionDepth(value: unknown) {
  let deepest = 0;
  const pending: Array<{ node: unknown; depth: number }> = [{ node: value, depth: 0 }];
  while (pending.length > 0) {
    const { node, depth } = pending.pop()!;
    if (!node || typeof node !== 'object') continue;
    const { type, geometries, features, geometry } = node as { type?: unknown; geometries?: unknown; features?: unknown; geometry?: unknown };
    if (type !== 'GeometryCollection' && type !== 'FeatureCollection' && type !== 'Feature') continue;
    deepest = Math.max(deepest, depth + 1);
    if (deepest > MAX_COLLECTION_DEPTH) return deepest;
    const children = [geometries, features].flatMap((list) => (Array.isArray(list) ? list : []));
    if (geometry) children.push(geometry);
    for (const child of children) pending.push({ node: child, depth: depth + 1 });
  }
  return deepest;
}

function refuseDeepNesting(value: unknown) {
  if (collectionDepth(value) > MAX_COLLECTION_DEPTH) {
    throw fault(
      'unparseable',
      `The boundary nests collections more than ${MAX_COLLECTION_DEPTH} levels deep; export the field outline as a plain Polygon or MultiPolygon and upload that.`,
    );
  }
}

function jsonOrNothing(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

/** Reads a boundary from a GeoJSON value or a file's text and checks it, on an analysis thread and then in PostGIS. */
export async function readBoundary(input: { boundary?: unknown; boundaryFile?: string }): Promise<MultiPolygon> {
  // Checked before the thread's parser walks the value, so a badly nested file gets a message rather than a crash.
  if (input.boundaryFile !== undefined) {
    if (/^\s*[[{]/.test(input.boundaryFile)) refuseDeepNesting(jsonOrNothing(input.boundaryFile));
  } else if (input.boundary !== undefined) refuseDeepNesting(input.boundary);
  const { boundary } = await runInAnalysisThread({ kind: 'boundary', input: { boundary: input.boundary, boundaryFile: input.boundaryFile } });
  const [check] = await sequelize.query<{ valid: boolean; reason: string | null; x: number | null; y: number | null }>(
    `SELECT d.valid, d.reason, ST_X(d.location) AS x, ST_Y(d.location) AS y
       FROM ST_IsValidDetail(ST_SetSRID(ST_GeomFromGeoJSON(:geojson), 4326)) d`,
    { replacements: { geojson: JSON.stringify(boundary) }, type: QueryTypes.SELECT },
  );
  if (!check.valid) throw postgisFault(check);
  return boundary;
}
