// What the machine-readable zone files (ISO 11783-10 task data, shapefile) carry: the farm, the field
// boundary, the zone-set version, and for each zone its area, stops, mean count and the pest's threshold.
import type { MultiPolygon } from 'geojson';
import { conflict } from '../../errors.ts';
import type { ZoneSetView } from '../../../shared/schemas/zones.ts';
import { findZoneSetFileFacts } from '../../queries/zone-sets.ts';
import { listZoneStopFigures } from '../../queries/zones.ts';

export interface ZoneFileZone {
  number: number;
  label: string;
  geometry: MultiPolygon;
  areaM2: number;
  areaHa: number;
  areaAc: number;
  /** Stops (sightings and empty stops of the pest) inside the zone. */
  stops: number;
  /** Mean count per stop inside the zone, zeros included; null when no stop with a count lies inside. */
  meanCount: number | null;
}

export interface ZoneFileSource {
  farmName: string;
  fieldName: string;
  fieldAreaM2: number;
  pestName: string;
  countUnit: string;
  threshold: number;
  thresholdSource: string;
  version: number;
  boundary: MultiPolygon;
  zones: ZoneFileZone[];
}

/**
 * Gathers a visible zone set's figures for export. Only the accepted version goes to a machine: a draft may
 * still change and a superseded one was replaced, so both are refused with a sentence.
 */
export async function zoneFileSource(zoneSet: ZoneSetView): Promise<ZoneFileSource> {
  if (zoneSet.status === 'draft')
    throw conflict(`Version ${zoneSet.version} of these zones is still a draft; accept it in the zone editor before exporting it for a sprayer.`);
  if (zoneSet.status === 'superseded')
    throw conflict(`Version ${zoneSet.version} of these zones was replaced by a later version; export the accepted version instead.`);
  const facts = await findZoneSetFileFacts(zoneSet.id);
  // The stops behind the zones: the check's own sightings, or (hand-drawn zones) the field's live ones of the pest.
  const perZone = await listZoneStopFigures(zoneSet, facts.sighting_ids);
  const figures = new Map(perZone.map((r) => [r.zone_id, r]));
  return {
    farmName: facts.farm_name,
    fieldName: zoneSet.fieldName,
    fieldAreaM2: facts.field_area_m2,
    pestName: zoneSet.pestName,
    countUnit: facts.count_unit,
    threshold: facts.action_threshold,
    thresholdSource: facts.threshold_source,
    version: zoneSet.version,
    boundary: JSON.parse(facts.boundary) as MultiPolygon,
    zones: zoneSet.zones.map((zone, i) => ({
      number: i + 1,
      label: zone.label,
      geometry: zone.geometry,
      areaM2: zone.areaM2,
      areaHa: zone.areaHa,
      areaAc: zone.areaAc,
      stops: figures.get(zone.id)?.stops ?? 0,
      meanCount: figures.get(zone.id)?.mean_count ?? null,
    })),
  };
}
