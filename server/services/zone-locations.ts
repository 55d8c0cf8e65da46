// Where an applicator finds each zone: its centre (latitude, longitude) and its distance and compass direction
// from the nearest corner of the field, measured on the sphere with turf.
import { bearing, booleanPointInPolygon, centroid, distance, pointOnFeature } from '@turf/turf';
import type { MultiPolygon, Position } from 'geojson';
import type { ZoneLocation } from '../../shared/schemas/notices.ts';

const COMPASS = ['N', 'NE', 'E', 'SE', 'S', 'SW', 'W', 'NW'] as const;

/** The eight-point compass word for a bearing in degrees clockwise from north. */
export function compassPoint(degrees: number): (typeof COMPASS)[number] {
  const normalised = ((degrees % 360) + 360) % 360;
  return COMPASS[Math.round(normalised / 45) % 8];
}

/** The field's corners: the vertices of its outer rings (the closing repeat left out). */
function fieldCorners(boundary: MultiPolygon): Position[] {
  return boundary.coordinates.flatMap((polygon) => polygon[0].slice(0, -1));
}

export function zoneLocation(zone: MultiPolygon, boundary: MultiPolygon): ZoneLocation {
  // The centroid, unless the zone's shape puts it outside the zone (a crescent); then a point surely inside it.
  const middle = centroid(zone).geometry.coordinates;
  const centre = booleanPointInPolygon(middle, zone) ? middle : pointOnFeature(zone).geometry.coordinates;
  let corner = fieldCorners(boundary)[0];
  let metres = Infinity;
  for (const candidate of fieldCorners(boundary)) {
    const d = distance(candidate, centre, { units: 'meters' });
    if (d < metres) [corner, metres] = [candidate, d];
  }
  const degrees = (bearing(corner, centre) + 360) % 360;
  return {
    centre: { lat: centre[1], lon: centre[0] },
    nearestCorner: { lat: corner[1], lon: corner[0] },
    distanceM: metres,
    bearingDeg: degrees,
    direction: compassPoint(degrees),
  };
}
