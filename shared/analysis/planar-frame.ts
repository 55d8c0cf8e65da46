// The engine's planar frame: a projection and an origin at the boundary's south-west corner (whole metres), so areas
// keep full precision. analyse() and the server's zone proposals share it, so both measure in the same place.
import type { Feature, Polygon } from 'geojson';
import { createPlanarField, isInsideField } from './field-geometry.ts';
import type { Projection } from './projection.ts';
import type { PlanarZone } from './zones.ts';

const M2_PER_HA = 10_000;
const M2_PER_AC = 4046.8564224;

export interface PlanarFrame {
  projection: Projection;
  originX: number;
  originY: number;
  /** The boundary's polygons in the frame (metres from the origin). */
  local: number[][][][];
}

export function planarFrame(polygons: number[][][][], projection: Projection): PlanarFrame {
  const projected = polygons.map((polygon) => polygon.map((ring) => ring.map(([x, y]) => projection.forward(x, y))));
  let originX = Infinity;
  let originY = Infinity;
  for (const polygon of projected)
    for (const ring of polygon)
      for (const [x, y] of ring) {
        originX = Math.min(originX, x);
        originY = Math.min(originY, y);
      }
  originX = Math.floor(originX);
  originY = Math.floor(originY);
  const local = projected.map((polygon) => polygon.map((ring) => ring.map(([x, y]) => [x - originX, y - originY])));
  return { projection, originX, originY, local };
}

/** A point of the frame back in the projection's own coordinates (longitude/latitude for UTM). */
export const frameToCoordinates = (frame: Pick<PlanarFrame, 'projection' | 'originX' | 'originY'>, x: number, y: number) =>
  frame.projection.inverse(x + frame.originX, y + frame.originY);

export interface ZoneFeatureProperties {
  zone: number;
  areaM2: number;
  areaHa: number;
  areaAc: number;
  shareOfField: number;
  sightings: number;
}

/** One treatment zone as a GeoJSON feature, numbered from 1, with its area and the found sightings (x, y pairs) inside it. */
export function zoneFeature(
  frame: Pick<PlanarFrame, 'projection' | 'originX' | 'originY'>,
  zone: PlanarZone,
  index: number,
  found: Float64Array,
  fieldAreaM2: number,
): Feature<Polygon, ZoneFeatureProperties> {
  const shape = createPlanarField([zone.rings]);
  let inside = 0;
  for (let i = 0; i < found.length; i += 2) if (isInsideField(shape, found[i], found[i + 1])) inside++;
  return {
    type: 'Feature',
    properties: {
      zone: index + 1,
      areaM2: zone.areaM2,
      areaHa: zone.areaM2 / M2_PER_HA,
      areaAc: zone.areaM2 / M2_PER_AC,
      shareOfField: zone.areaM2 / fieldAreaM2,
      sightings: inside,
    },
    geometry: { type: 'Polygon', coordinates: zone.rings.map((ring) => ring.map(([x, y]) => frameToCoordinates(frame, x, y))) },
  };
}
