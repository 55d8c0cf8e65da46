// Reads the boundary and sightings GeoJSON (RFC 7946) into plain arrays, with errors that say what to fix.
import { z } from 'zod';
import { AnalysisInputError } from './errors.ts';

const position = z.array(z.number().finite()).min(2);
const ring = z.array(position).min(4);
const polygonGeometry = z.object({ type: z.literal('Polygon'), coordinates: z.array(ring).min(1) });
const multiPolygonGeometry = z.object({ type: z.literal('MultiPolygon'), coordinates: z.array(z.array(ring).min(1)).min(1) });
const areaGeometry = z.union([polygonGeometry, multiPolygonGeometry]);

const pointFeature = z.object({
  type: z.literal('Feature'),
  id: z.union([z.string(), z.number()]).optional(),
  geometry: z.object({ type: z.literal('Point'), coordinates: position }),
  properties: z
    .object({
      count: z.number().finite().min(0).nullable().optional(),
      id: z.union([z.string(), z.number()]).optional(),
      walk: z.union([z.string(), z.number()]).nullable().optional(),
      accuracyM: z.number().finite().min(0).nullable().optional(),
    })
    .passthrough()
    .nullable()
    .optional(),
});
const sightingsCollection = z.object({ type: z.literal('FeatureCollection'), features: z.array(z.unknown()) });

export interface SightingInput {
  id: string;
  x: number;
  y: number;
  /** null when the sighting carries no number; 0 marks an empty stop. */
  count: number | null;
  /** The walk the sighting was made on; sightings without one count as one walk. */
  walk: string;
  /** Stated GPS accuracy of the position in metres, when known. */
  accuracyM: number | null;
}

/** Polygon rings from a Polygon, MultiPolygon, a Feature of one, or a FeatureCollection of such Features. */
export function readBoundary(input: unknown): number[][][][] {
  const candidates: unknown[] = [];
  const value = input as { type?: unknown; geometry?: unknown; features?: unknown };
  if (value && typeof value === 'object') {
    if (value.type === 'Feature') candidates.push(value.geometry);
    else if (value.type === 'FeatureCollection' && Array.isArray(value.features)) {
      for (const feature of value.features) candidates.push((feature as { geometry?: unknown })?.geometry);
    } else candidates.push(value);
  }
  const polygons: number[][][][] = [];
  let sawArea = false;
  for (const candidate of candidates) {
    const type = (candidate as { type?: unknown })?.type;
    if (type !== 'Polygon' && type !== 'MultiPolygon') continue;
    sawArea = true;
    const parsed = areaGeometry.safeParse(candidate);
    if (!parsed.success) throw new AnalysisInputError('The boundary polygon is malformed: every ring needs at least four [x, y] positions of finite numbers.');
    if (parsed.data.type === 'Polygon') polygons.push(parsed.data.coordinates);
    else polygons.push(...parsed.data.coordinates);
  }
  if (!sawArea) throw new AnalysisInputError('The boundary holds no Polygon or MultiPolygon; give the field boundary as GeoJSON.');
  return polygons;
}

/** Sightings from a FeatureCollection of Points; count must be a number ≥ 0 or absent. */
export function readSightings(input: unknown): SightingInput[] {
  const collection = sightingsCollection.safeParse(input);
  if (!collection.success) throw new AnalysisInputError('The sightings are not a GeoJSON FeatureCollection.');
  return collection.data.features.map((raw, index) => {
    const parsed = pointFeature.safeParse(raw);
    if (!parsed.success) {
      const issue = parsed.error.issues[0];
      const where = issue.path.join('.');
      const reason = where.includes('count')
        ? 'its count must be a number of 0 or more'
        : where.includes('accuracyM')
          ? 'its accuracyM must be a number of metres, 0 or more'
          : where.includes('walk')
            ? 'its walk must be a text or a number'
            : 'it must be a Point Feature with [x, y] coordinates';
      throw new AnalysisInputError(`Sighting ${index + 1} is not usable: ${reason}.`);
    }
    const feature = parsed.data;
    const id = feature.properties?.id ?? feature.id ?? `#${index + 1}`;
    return {
      id: String(id),
      x: feature.geometry.coordinates[0],
      y: feature.geometry.coordinates[1],
      count: feature.properties?.count ?? null,
      walk: String(feature.properties?.walk ?? ''),
      accuracyM: feature.properties?.accuracyM ?? null,
    };
  });
}
