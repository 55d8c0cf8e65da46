// WGS 84 longitude/latitude to planar metres: the UTM zone of the field's centroid, through proj4.
import proj4 from 'proj4';

export interface Projection {
  /** e.g. EPSG:32614, or "planar" when the input was already in metres. */
  crs: string;
  definition: string | null;
  forward(x: number, y: number): [number, number];
  inverse(x: number, y: number): [number, number];
}

/** UTM zone number (1–60) for a longitude; the Norway and Svalbard exceptions are not applied. */
export function utmZone(longitude: number): number {
  return Math.min(60, Math.max(1, Math.floor((longitude + 180) / 6) + 1));
}

/** The projection for a field whose centroid is at (longitude, latitude). */
export function utmProjectionFor(longitude: number, latitude: number): Projection {
  const zone = utmZone(longitude);
  const south = latitude < 0;
  const definition = `+proj=utm +zone=${zone}${south ? ' +south' : ''} +datum=WGS84 +units=m +no_defs`;
  const converter = proj4('WGS84', definition);
  return {
    crs: `EPSG:${south ? 327 : 326}${String(zone).padStart(2, '0')}`,
    definition,
    forward: (x, y) => converter.forward([x, y]) as [number, number],
    inverse: (x, y) => converter.inverse([x, y]) as [number, number],
  };
}

export const planarProjection: Projection = {
  crs: 'planar',
  definition: null,
  forward: (x, y) => [x, y],
  inverse: (x, y) => [x, y],
};

/** Vertex-mean centroid of the outer rings, in the input's coordinates. */
export function boundaryCentroid(polygons: number[][][][]): [number, number] {
  let sx = 0;
  let sy = 0;
  let count = 0;
  for (const polygon of polygons) {
    const outer = polygon[0];
    for (let i = 0; i < outer.length - 1; i++) {
      sx += outer[i][0];
      sy += outer[i][1];
      count++;
    }
  }
  return [sx / count, sy / count];
}
