import { DOMParser } from '@xmldom/xmldom';
import type { MultiPolygon } from 'geojson';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import { boundaryFromGeoJson, parseBoundaryText } from '../../shared/boundary/parse-boundary.ts';
import { validateBoundary } from '../../shared/boundary/validate-boundary.ts';
import { fault } from '../../shared/boundary/boundary-faults.ts';

// Faults turf's kinks check cannot see, found by PostGIS: a hole outside its shell, parts that overlap, and the like.
function postgisFault({ reason, x, y }: { reason: string | null; x: number | null; y: number | null }) {
  const near = x !== null && y !== null ? ` near (${x.toFixed(6)}, ${y.toFixed(6)})` : '';
  if (/hole lies outside shell/i.test(reason ?? '')) {
    return fault('hole-outside-shell', `A hole in the boundary lies outside its outer ring${near}; a hole must sit inside the outline, so remove it or redraw it inside.`);
  }
  return fault('self-intersecting', `The boundary is not a valid polygon (${reason ?? 'unknown reason'}${near}); check that holes lie inside the outline and parts do not overlap.`);
}

/** Reads a boundary from a GeoJSON value or a file's text and checks it, in code and then in PostGIS. */
export async function readBoundary(input: { boundary?: unknown; boundaryFile?: string }): Promise<MultiPolygon> {
  let boundary: MultiPolygon;
  if (input.boundaryFile !== undefined) boundary = parseBoundaryText(input.boundaryFile, DOMParser as never);
  else if (input.boundary !== undefined) boundary = boundaryFromGeoJson(input.boundary);
  else throw fault('not-polygon', 'Add a boundary: upload a GeoJSON or KML file, or draw it on the map.');
  // Checked before anything walks the coordinates, so a badly nested file gets a message rather than a crash.
  validateBoundary(boundary);
  // Keep longitude and latitude only: heights in a KML file are not part of a field's outline.
  boundary = { type: 'MultiPolygon', coordinates: boundary.coordinates.map((p) => p.map((r) => r.map(([x, y]) => [x, y]))) };
  const [check] = await sequelize.query<{ valid: boolean; reason: string | null; x: number | null; y: number | null }>(
    `SELECT d.valid, d.reason, ST_X(d.location) AS x, ST_Y(d.location) AS y
       FROM ST_IsValidDetail(ST_SetSRID(ST_GeomFromGeoJSON(:geojson), 4326)) d`,
    { replacements: { geojson: JSON.stringify(boundary) }, type: QueryTypes.SELECT },
  );
  if (!check.valid) throw postgisFault(check);
  return boundary;
}
