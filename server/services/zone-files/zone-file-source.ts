// What the machine-readable zone files (ISO 11783-10 task data, shapefile) carry: the farm, the field
// boundary, the zone-set version, and for each zone its area, stops, mean count and the pest's threshold.
import type { MultiPolygon } from 'geojson';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../db.ts';
import { conflict } from '../../errors.ts';
import type { ZoneSetView } from '../../../shared/schemas/zones.ts';
import { liveSighting } from '../../queries/sightings.ts';

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
  const [facts] = await sequelize.query<{
    farm_name: string;
    field_area_m2: number;
    boundary: string;
    count_unit: string;
    action_threshold: number;
    threshold_source: string;
    sighting_ids: string[] | null;
  }>(
    `SELECT fa.name AS farm_name, f.area_m2 AS field_area_m2, ST_AsGeoJSON(ST_ForcePolygonCCW(f.boundary), 9) AS boundary,
            p.count_unit, p.action_threshold, p.threshold_source, pc.sighting_ids
       FROM zone_sets zs JOIN fields f ON f.id = zs.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = zs.pest_id
       LEFT JOIN pattern_checks pc ON pc.id = zs.check_id
      WHERE zs.id = :id`,
    { replacements: { id: zoneSet.id }, type: QueryTypes.SELECT },
  );
  // The stops behind the zones: the check's own sightings, or (hand-drawn zones) the field's live ones of the pest.
  const stopsFilter = facts.sighting_ids ? 's.id = ANY(CAST(:ids AS uuid[]))' : 's.field_id = :fieldId AND s.pest_id = :pestId';
  const perZone = await sequelize.query<{ zone_id: string; stops: number; mean_count: number | null }>(
    `SELECT z.id AS zone_id, count(s.id)::int AS stops, avg(s.count) AS mean_count
       FROM zones z LEFT JOIN sightings s
         ON ${stopsFilter} AND ${liveSighting('s')} AND ST_Covers(z.geometry, s.position)
      WHERE z.zone_set_id = :zoneSetId GROUP BY z.id`,
    {
      replacements: { ids: `{${(facts.sighting_ids ?? []).join(',')}}`, fieldId: zoneSet.fieldId, pestId: zoneSet.pestId, zoneSetId: zoneSet.id },
      type: QueryTypes.SELECT,
    },
  );
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
