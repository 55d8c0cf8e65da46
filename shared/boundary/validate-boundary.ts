import { area as turfArea, polygon as turfPolygon } from '@turf/turf';
import sweeplineIntersections from 'sweepline-intersections';
import type { MultiPolygon, Position } from 'geojson';
import { fault } from './boundary-faults.ts';
import { SQUARE_METRES_PER_HECTARE } from '../units/area.ts';

// Plausible field sizes: below 0.05 ha is a garden plot or a drawing slip, above 5,000 ha is a region.
export const MIN_FIELD_M2 = 0.05 * SQUARE_METRES_PER_HECTARE;
export const MAX_FIELD_M2 = 5000 * SQUARE_METRES_PER_HECTARE;

/**
 * The most corners a boundary or zone may have (all rings and parts together). A field traced by GPS at 1 m spacing
 * around a 250 ha square has about 6,300; the crossing check's worst case (long interleaved edges) grows with the
 * square of the corners, so the limit also bounds how long one upload can keep a thread busy.
 */
export const MAX_BOUNDARY_CORNERS = 20_000;

const samePosition = (a: Position, b: Position) => a[0] === b[0] && a[1] === b[1];

function checkRing(ring: Position[], where: string) {
  // The usual hand-editing slip: a Polygon's coordinates written as one ring instead of a list of rings.
  if (Array.isArray(ring) && ring.length > 0 && ring.every((v) => typeof v === 'number')) {
    throw fault(
      'unparseable',
      `${where} is a single position, not a list of positions: a Polygon's coordinates are a list of rings, each a list of [longitude, latitude] pairs; check the brackets.`,
    );
  }
  if (!Array.isArray(ring) || ring.length < 4) {
    throw fault('ring-too-short', `${where} has fewer than 4 positions; a closed ring needs at least 3 corners plus the first corner repeated.`);
  }
  for (const position of ring) {
    if (!Array.isArray(position) || position.length < 2 || !position.slice(0, 2).every((v) => typeof v === 'number' && Number.isFinite(v))) {
      throw fault('unparseable', `${where} has a position that is not a pair of numbers.`);
    }
  }
  if (!samePosition(ring[0], ring[ring.length - 1])) {
    throw fault('ring-not-closed', `${where} is not closed: its last position must repeat its first (${ring[0].join(', ')}).`);
  }
}

function checkRange(positions: Position[]) {
  const outOfRange = positions.find(([x, y]) => Math.abs(x) > 180 || Math.abs(y) > 90);
  if (!outOfRange) return;
  const looksSwapped = positions.every(([x, y]) => Math.abs(x) <= 90 && Math.abs(y) <= 180);
  if (looksSwapped) {
    throw fault(
      'swapped-coordinates',
      `Coordinates look swapped: GeoJSON lists longitude first, then latitude, but (${outOfRange[0]}, ${outOfRange[1]}) has a latitude beyond ±90°. Swap each pair and upload again.`,
    );
  }
  throw fault('out-of-range', `Position (${outOfRange[0]}, ${outOfRange[1]}) is outside WGS 84: longitude must be within ±180° and latitude within ±90°.`);
}

/** A ring's corners: its positions without the closing repeat of the first. */
const cornerCount = (boundary: MultiPolygon) =>
  boundary.coordinates.reduce((sum, polygon) => sum + polygon.reduce((inner, ring) => inner + ring.length - 1, 0), 0);

function checkCornerCount(boundary: MultiPolygon) {
  const corners = cornerCount(boundary);
  if (corners <= MAX_BOUNDARY_CORNERS) return;
  throw fault(
    'too-many-corners',
    `This boundary has ${corners.toLocaleString('en')} corners; Patchwise takes at most ${MAX_BOUNDARY_CORNERS.toLocaleString('en')} — simplify it (for example to one corner every metre or two) and upload again.`,
  );
}

/** Checks a MultiPolygon in WGS 84 and returns its area in m² on the sphere (turf), throwing a BoundaryError for each fault. */
export function validateBoundary(boundary: MultiPolygon): { areaM2: number } {
  if (boundary.coordinates.length === 0) throw fault('not-polygon', 'The boundary holds no polygon.');
  boundary.coordinates.forEach((polygon, p) => {
    if (!Array.isArray(polygon)) throw fault('unparseable', `Polygon ${p + 1} is not a list of rings; check the brackets of the coordinates.`);
    polygon.forEach((ring, r) => checkRing(ring, `${r === 0 ? 'The outer ring' : `Hole ${r}`} of polygon ${p + 1}`));
  });
  checkCornerCount(boundary);
  const positions = boundary.coordinates.flat(2);
  checkRange(positions);
  boundary.coordinates.forEach((polygon, p) => {
    // A sweep over the edges sorted by x: each edge is tested only against the edges its x-extent overlaps.
    const crossings = sweeplineIntersections(turfPolygon(polygon), false);
    if (crossings.length > 0) {
      const [x, y] = crossings[0];
      throw fault(
        'self-intersecting',
        `Polygon ${p + 1} crosses itself near (${x.toFixed(6)}, ${y.toFixed(6)}); redraw the boundary so its edges do not cross.`,
      );
    }
  });
  const areaM2 = turfArea(boundary);
  if (areaM2 < MIN_FIELD_M2) {
    throw fault(
      'area-too-small',
      `The boundary covers ${(areaM2 / SQUARE_METRES_PER_HECTARE).toFixed(3)} ha, under the 0.05 ha a field needs; check that it is drawn at the right place and scale.`,
    );
  }
  if (areaM2 > MAX_FIELD_M2) {
    throw fault(
      'area-too-large',
      `The boundary covers ${Math.round(areaM2 / SQUARE_METRES_PER_HECTARE).toLocaleString('en')} ha, over the 5,000 ha a field can have; check that it outlines one field.`,
    );
  }
  return { areaM2 };
}
