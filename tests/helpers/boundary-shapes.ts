// Boundaries for tests, drawn where the test says: rectangles of a given size and the classic faulty shapes.
import proj4 from 'proj4';
import type { Polygon, Position } from 'geojson';

/** The UTM zone (north) a longitude falls in, as a proj4 definition: zone = floor((lon + 180) / 6) + 1. */
export function utmNorth(lon: number) {
  const zone = Math.floor((lon + 180) / 6) + 1;
  return { zone, definition: `+proj=utm +zone=${zone} +datum=WGS84 +units=m +no_defs` };
}

/**
 * A rectangle widthM × heightM metres whose south-west corner is at (lon, lat), laid out on the UTM grid
 * (proj4), so its planar area is exactly widthM × heightM in that projection.
 */
export function utmRectangle(lon: number, lat: number, widthM: number, heightM: number): Polygon {
  const { definition } = utmNorth(lon);
  const [x0, y0] = proj4('WGS84', definition, [lon, lat]);
  const corners: Position[] = [
    [x0, y0],
    [x0 + widthM, y0],
    [x0 + widthM, y0 + heightM],
    [x0, y0 + heightM],
  ].map((xy) => proj4(definition, 'WGS84', xy));
  return { type: 'Polygon', coordinates: [[...corners, corners[0]]] };
}

/** A rectangle in degrees: south-west corner (lon, lat), dLon wide and dLat high, counter-clockwise. */
export function degreeRectangle(lon: number, lat: number, dLon: number, dLat: number): Polygon {
  return {
    type: 'Polygon',
    coordinates: [
      [
        [lon, lat],
        [lon + dLon, lat],
        [lon + dLon, lat + dLat],
        [lon, lat + dLat],
        [lon, lat],
      ],
    ],
  };
}

/** A field of about 400 m × 250 m (10 ha) in open farmland of our choosing (central Iowa). */
export const TEST_FIELD_ORIGIN = { lon: -93.62, lat: 42.03 } as const;
export const plainField = (offsetIndex = 0): Polygon => utmRectangle(TEST_FIELD_ORIGIN.lon + offsetIndex * 0.01, TEST_FIELD_ORIGIN.lat, 400, 250);
