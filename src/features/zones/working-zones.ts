// The zones on the editor's map before they are accepted: proposed by the engine, then edited or drawn by hand.
// Figures for a zone the engine proposed are the engine's; a zone changed in the browser is measured here with
// turf (spherical area) until the server measures the accepted version on the ellipsoid.
import { area, booleanPointInPolygon, feature, featureCollection, union } from '@turf/turf';
import type { Feature, FeatureCollection, MultiPolygon, Polygon } from 'geojson';
import type { ProposedZoneProperties, ZoneSetView, ZoneView } from '@shared/schemas/zones.ts';
import type { SightingView } from '@shared/schemas/sightings.ts';

export type ZoneOrigin = 'proposed' | 'edited' | 'drawn' | 'stored';

export interface WorkingZone {
  key: string;
  label: string;
  geometry: Polygon | MultiPolygon;
  origin: ZoneOrigin;
  /** The engine's figures, kept while the zone is as proposed. */
  proposed?: ProposedZoneProperties;
  /** The server's figures, kept while the zone is as stored. */
  stored?: ZoneView;
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
  return proposal.features.map((f) => ({
    key: newZoneKey(),
    label: `Zone ${f.properties.zone}`,
    geometry: f.geometry,
    origin: 'proposed',
    proposed: f.properties,
  }));
}

/** The zones of a stored version, as the server keeps them (clipped to the field, measured on the ellipsoid). */
export function zonesFromStored(set: Pick<ZoneSetView, 'zones'>): WorkingZone[] {
  return set.zones.map((z) => ({ key: newZoneKey(), label: z.label, geometry: z.geometry, origin: 'stored', stored: z }));
}

/** A zone reshaped on the map: its engine figures no longer apply; a hand-drawn zone stays hand-drawn. */
export function reshapeZone(zones: WorkingZone[], key: string, geometry: Polygon | MultiPolygon): WorkingZone[] {
  return zones.map((z) => (z.key === key ? { ...z, geometry, origin: z.origin === 'drawn' ? 'drawn' : 'edited', proposed: undefined, stored: undefined } : z));
}

export const removeZone = (zones: WorkingZone[], key: string) => zones.filter((z) => z.key !== key);

export function addDrawnZone(zones: WorkingZone[], geometry: Polygon | MultiPolygon): WorkingZone[] {
  return [...zones, { key: newZoneKey(), label: nextZoneLabel(zones), geometry, origin: 'drawn' }];
}

/**
 * Where the pest was found, as [lon, lat]: the check's own sightings, or every placed one on the field for
 * zones drawn without a check. Empty stops (count 0) are places the scout looked and found nothing.
 */
export function foundSightingPoints(sightings: Pick<SightingView, 'id' | 'count' | 'position'>[], checkSightingIds: string[] | null): SightingPoint[] {
  const inCheck = checkSightingIds ? new Set(checkSightingIds) : null;
  const points: SightingPoint[] = [];
  for (const s of sightings) if (s.position && s.count !== 0 && (!inCheck || inCheck.has(s.id))) points.push([s.position.lon, s.position.lat]);
  return points;
}

/** The next free "Zone n" label, so a drawn zone never repeats a label in the table. */
export function nextZoneLabel(zones: WorkingZone[]) {
  const used = new Set(zones.map((z) => z.label));
  let n = zones.length + 1;
  while (used.has(`Zone ${n}`)) n += 1;
  return `Zone ${n}`;
}

export function zoneFigures(zone: WorkingZone, fieldAreaM2: number, sightings: SightingPoint[]): ZoneFigures {
  if (zone.origin === 'stored' && zone.stored) {
    return { areaM2: zone.stored.areaM2, shareOfField: zone.stored.shareOfField, sightingsInside: zone.stored.sightingsInside, fromEngine: true };
  }
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

/** A stop with a count as [lon, lat, count]: empty stops are 0, sightings without a count stay out. */
export type CountedStop = [number, number, number];

/** The stops with a count, of the check's own sightings or every placed one on the field. */
export function countedStops(sightings: Pick<SightingView, 'id' | 'count' | 'position'>[], checkSightingIds: string[] | null): CountedStop[] {
  const inCheck = checkSightingIds ? new Set(checkSightingIds) : null;
  const stops: CountedStop[] = [];
  for (const s of sightings) if (s.position && s.count !== null && (!inCheck || inCheck.has(s.id))) stops.push([s.position.lon, s.position.lat, s.count]);
  return stops;
}

export interface ZoneStanding {
  /** Mean count per stop inside the zone (mean basis) or share of its stops infested (incidence basis); null without stops. */
  value: number | null;
  stops: number;
  /** Treatment zones are drawn where the figure reaches the threshold, so reaching it counts as above. */
  standing: 'at-or-above' | 'below' | 'no-stops';
}

/** A zone's stops held against the pest's action threshold, on the threshold's own basis. */
export function zoneStanding(
  zone: Pick<WorkingZone, 'geometry'>,
  stops: CountedStop[],
  threshold: { actionThreshold: number; thresholdBasis: 'mean' | 'incidence' },
): ZoneStanding {
  const shape = feature(zone.geometry);
  const inside = stops.filter(([lon, lat]) => booleanPointInPolygon([lon, lat], shape)).map(([, , count]) => count);
  if (inside.length === 0) return { value: null, stops: 0, standing: 'no-stops' };
  const value =
    threshold.thresholdBasis === 'incidence' ? inside.filter((c) => c > 0).length / inside.length : inside.reduce((sum, c) => sum + c, 0) / inside.length;
  return { value, stops: inside.length, standing: value >= threshold.actionThreshold ? 'at-or-above' : 'below' };
}
