// The treatment-zone API's contract: proposal and zone-set requests (zod) and the answers' types.
import { z } from 'zod';
import { oneLineNameSchema } from './one-line-name.ts';
import type { FeatureCollection, MultiPolygon, Polygon } from 'geojson';

export const zoneSetStatuses = ['draft', 'accepted', 'superseded'] as const;
export type ZoneSetStatus = (typeof zoneSetStatuses)[number];

export const zoneProposalSchema = z
  .object({
    source: z.enum(['density', 'quadrat'], { error: 'Choose where zones come from: density or quadrat.' }),
    /** density: sightings per ha; quadrat: the pest's count unit (default: the pest's action threshold). */
    threshold: z.number({ error: 'The threshold must be a number.' }).positive('The threshold must be more than 0.').optional(),
    marginM: z
      .number({ error: 'The margin must be a number of metres.' })
      .min(0, 'The margin cannot be negative.')
      .max(500, 'The margin must be at most 500 m.')
      .optional(),
    minZoneAreaM2: z
      .number({ error: 'The smallest zone area must be a number of m².' })
      .min(0, 'The smallest zone area cannot be negative.')
      .max(10_000_000, 'The smallest zone area must be at most 1,000 ha.')
      .optional(),
  })
  .strict();
export type ZoneProposalRequest = z.output<typeof zoneProposalSchema>;

const position = z
  .array(z.number({ error: 'Each coordinate must be a number.' }).finite('Each coordinate must be a finite number.'), {
    error: 'Each position must be a [longitude, latitude] pair.',
  })
  .min(2, 'Each position needs a longitude and a latitude.');
const ring = z.array(position, { error: 'Each ring must be a list of positions.' });
const polygonGeometry = z.object({
  type: z.literal('Polygon'),
  coordinates: z.array(ring, { error: 'A Polygon needs a list of rings.' }).min(1, 'A Polygon needs at least its outer ring.'),
});
const multiPolygonGeometry = z.object({
  type: z.literal('MultiPolygon'),
  coordinates: z.array(z.array(ring).min(1), { error: 'A MultiPolygon needs a list of polygons.' }).min(1, 'A MultiPolygon needs at least one polygon.'),
});

export const zoneFeatureSchema = z.object({
  type: z.literal('Feature', { error: 'Each zone must be a GeoJSON Feature.' }),
  geometry: z.discriminatedUnion('type', [polygonGeometry, multiPolygonGeometry], { error: 'Each zone must be a Polygon or MultiPolygon.' }),
  properties: z
    .object({ label: oneLineNameSchema('Give the zone a label, or leave it out.', 80, 'A zone label can have at most 80 characters.').optional() })
    .loose()
    .nullable()
    .optional(),
});

export const zoneSetCreateSchema = z
  .object({
    checkId: z.uuid({ error: 'That check id is not valid.' }).optional(),
    pestId: z.uuid({ error: 'Choose the pest these zones are for.' }),
    zones: z.object({
      type: z.literal('FeatureCollection', { error: 'Send the zones as a GeoJSON FeatureCollection.' }),
      features: z
        .array(zoneFeatureSchema, { error: 'The FeatureCollection needs a "features" list.' })
        .min(1, 'Add at least one zone.')
        .max(200, 'A zone set can hold at most 200 zones.'),
    }),
  })
  .strict();
export type ZoneSetCreateRequest = z.output<typeof zoneSetCreateSchema>;

export interface ProposedZoneProperties {
  zone: number;
  areaM2: number;
  areaHa: number;
  areaAc: number;
  shareOfField: number;
  sightings: number;
}
export interface ZoneProposalResponse {
  zones: FeatureCollection<Polygon, ProposedZoneProperties> & {
    source: 'density' | 'quadrat';
    threshold: number;
    marginM: number;
    minZoneAreaM2: number;
    note: string;
  };
}

export interface ZoneView {
  id: string;
  label: string;
  areaM2: number;
  areaHa: number;
  areaAc: number;
  shareOfField: number;
  sightingsInside: number;
  geometry: MultiPolygon;
}
export interface ZoneSetView {
  id: string;
  fieldId: string;
  fieldName: string;
  pestId: string;
  pestName: string;
  checkId: string | null;
  version: number;
  status: ZoneSetStatus;
  createdBy: { id: string; name: string };
  createdAt: string;
  acceptedAt: string | null;
  fieldAreaM2: number;
  zones: ZoneView[];
  totalTreatedM2: number;
  untreatedShare: number;
}
export interface ZoneSetResponse {
  zoneSet: ZoneSetView;
  /** Sentences about zones that were clipped to the field or dropped as slivers. */
  adjustments?: string[];
}
export interface ZoneSetListResponse {
  zoneSets: Array<Omit<ZoneSetView, 'zones'> & { zoneCount: number }>;
}
