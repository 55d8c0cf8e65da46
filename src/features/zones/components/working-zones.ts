// The zones on the editor's map before they are accepted: proposed by the engine, then edited or drawn by hand.
// Figures for a zone the engine proposed are the engine's; a zone changed in the browser is measured here with
// turf (spherical area) until the server measures the accepted version on the ellipsoid.
import { area, booleanPointInPolygon, feature, featureCollection, union } from '@turf/turf';
import type { Feature, FeatureCollection, MultiPolygon, Polygon } from 'geojson';
import type { ProposedZoneProperties } from '@shared/schemas/zones.ts';

export type ZoneOrigin = 'proposed' | 'edited' | 'drawn';

export interface WorkingZone {
  key: string;
  label: string;
  geometry: Polygon | MultiPolygon;
  origin: ZoneOrigin;
  /** The engine's figures, kept while the zone is as proposed. */
  proposed?: ProposedZoneProperties;
}

export interface ZoneFigures {
  areaM2: number;
  shareOfField: number;
  sightingsInside: number;
  /** True when the figures come from the engine rather than the browser. */
  fromEngine: boolean;
}

export type SightingPoint = [number, number];

let nextKey = 0;
export const newZoneKey = () => `zone-${++nextKey}`;

export function zonesFromProposal(proposal: FeatureCollection<Polygon, ProposedZoneProperties>): WorkingZone[] {
  return proposal.features.map((f) => ({ key: newZoneKey(), label: `Zone ${f.properties.zone}`, geometry: f.geometry, origin: 'proposed', proposed: f.properties }));
}

/** The next free "Zone n" label, so a drawn zone never repeats a label in the table. */
export function nextZoneLabel(zones: WorkingZone[]) {
  const used = new Set(zones.map((z) => z.label));
  let n = zones.length + 1;
  while (used.has(`Zone ${n}`)) n += 1;
  return `Zone ${n}`;
}

export function zoneFigures(zone: WorkingZone, fieldAreaM2: number, sightings: SightingPoint[]): ZoneFigures {
  if (zone.origin === 'proposed' && zone.proposed) {
    return { areaM2: zone.proposed.areaM2, shareOfField: zone.proposed.shareOfField, sightingsInside: zone.proposed.sightings, fromEngine: true };
  }
  const areaM2 = area(zone.geometry);
  const shape = feature(zone.geometry);
  return {
    areaM2,
    shareOfField: fieldAreaM2 > 0 ? Math.min(1, areaM2 / fieldAreaM2) : 0,
    sightingsInside: sightings.filter((p) => booleanPointInPolygon(p, shape)).length,
    fromEngine: false,
  };
}

/** Overlapping zones are treated once: the total is the area of their union. */
export function treatedAreaM2(zones: WorkingZone[], figures: ZoneFigures[]) {
  if (zones.length === 0) return 0;
  if (zones.length === 1) return figures[0].areaM2;
  try {
    const merged = union(featureCollection(zones.map((z) => feature(z.geometry) as Feature<Polygon | MultiPolygon>)));
    return merged ? area(merged) : 0;
  } catch {
    // A zone being redrawn can be momentarily invalid; fall back to the plain sum.
    return figures.reduce((sum, f) => sum + f.areaM2, 0);
  }
}

/** The FeatureCollection the server stores: each zone's label in its properties. */
export function zonesForAcceptance(zones: WorkingZone[]): FeatureCollection<Polygon | MultiPolygon, { label: string }> {
  return { type: 'FeatureCollection', features: zones.map((z) => ({ type: 'Feature', properties: { label: z.label }, geometry: z.geometry })) };
}
