import type { MultiPolygon } from 'geojson';
import { execute, selectRow, selectRows, type InTransaction } from './sql.ts';
import { liveSighting } from './sightings.ts';

export interface ClipMeasure {
  valid: boolean;
  reason: string;
  drawn_m2: number;
  parts_m2: number[] | null;
  kept: string | null;
  kept_m2: number | null;
}

/** A drawn zone clipped to the field: whether it is valid, its area drawn, the areas of its parts inside and the parts of at least `minArea` m². */
export const clipZoneToField = async (fieldId: string, geometry: MultiPolygon, minAreaM2: number, options: InTransaction = {}) =>
  (await selectRow<ClipMeasure>(
    `WITH z AS (SELECT ST_SetSRID(ST_GeomFromGeoJSON(:geojson), 4326) AS g),
            clipped AS (
              SELECT (ST_Dump(ST_CollectionExtract(ST_Intersection(z.g, f.boundary), 3))).geom AS part FROM z, fields f
               WHERE f.id = :fieldId AND ST_IsValid(z.g)),
            measured AS (SELECT part, ST_Area(part::geography, true) AS m2 FROM clipped)
       SELECT ST_IsValid(z.g) AS valid, ST_IsValidReason(z.g) AS reason,
              CASE WHEN ST_IsValid(z.g) THEN ST_Area(z.g::geography, true) ELSE 0 END AS drawn_m2,
              (SELECT array_agg(m2) FROM measured) AS parts_m2,
              (SELECT ST_AsGeoJSON(ST_Multi(ST_Union(part))) FROM measured WHERE m2 >= :minArea) AS kept,
              (SELECT ST_Area(ST_Union(part)::geography, true) FROM measured WHERE m2 >= :minArea) AS kept_m2
         FROM z`,
    { geojson: JSON.stringify(geometry), fieldId, minArea: minAreaM2 },
    options,
  ))!;

export interface NewZone {
  zoneSetId: string;
  position: number;
  label: string;
  /** GeoJSON text. */
  geojson: string;
  fieldId: string;
  pestId: string;
  /** The sightings a zone may count (the check's), or null for every live one of the pest in the field. */
  sightingIds: string[] | null;
}

/** Stores a zone with its share of the field and the live sightings with the pest found inside it. */
export const insertZone = (zone: NewZone, options: InTransaction = {}) =>
  execute(
    `INSERT INTO zones (zone_set_id, position, label, geometry, share_of_field, sightings_inside)
         SELECT :zoneSetId, :position, :label, g, LEAST(1, ST_Area(g::geography, true) / NULLIF(f.area_m2, 0)),
                (SELECT count(*) FROM sightings s
                  WHERE s.field_id = f.id AND s.pest_id = :pestId AND ${liveSighting('s')}
                    AND (s.count IS NULL OR s.count > 0) AND ST_Covers(g, s.position)
                    AND (CAST(:ids AS uuid[]) IS NULL OR s.id = ANY(CAST(:ids AS uuid[]))))
           FROM (SELECT ST_SetSRID(ST_GeomFromGeoJSON(:geojson), 4326) AS g) z, fields f WHERE f.id = :fieldId`,
    {
      zoneSetId: zone.zoneSetId,
      position: zone.position,
      label: zone.label,
      geojson: zone.geojson,
      fieldId: zone.fieldId,
      pestId: zone.pestId,
      ids: zone.sightingIds ? `{${zone.sightingIds.join(',')}}` : null,
    },
    options,
  );

export interface ZoneRow {
  id: string;
  label: string;
  area_m2: number;
  share_of_field: number;
  sightings_inside: number;
  /** GeoJSON text, outer rings counter-clockwise. */
  geometry: string;
}

export const listZonesOfSet = (zoneSetId: string) =>
  selectRows<ZoneRow>(
    `SELECT id, label, area_m2, share_of_field, sightings_inside, ST_AsGeoJSON(ST_ForcePolygonCCW(geometry), 9) AS geometry
       FROM zones WHERE zone_set_id = :zoneSetId ORDER BY position`,
    { zoneSetId },
  );

/**
 * Live stops inside each zone of a set and their mean count: the check's own sightings when `sightingIds` is given,
 * else (hand-drawn zones) the field's live ones of the pest.
 */
export function listZoneStopFigures(zoneSet: { id: string; fieldId: string; pestId: string }, sightingIds: string[] | null) {
  const stopsFilter = sightingIds ? 's.id = ANY(CAST(:ids AS uuid[]))' : 's.field_id = :fieldId AND s.pest_id = :pestId';
  return selectRows<{ zone_id: string; stops: number; mean_count: number | null }>(
    `SELECT z.id AS zone_id, count(s.id)::int AS stops, avg(s.count) AS mean_count
       FROM zones z LEFT JOIN sightings s
         ON ${stopsFilter} AND ${liveSighting('s')} AND ST_Covers(z.geometry, s.position)
      WHERE z.zone_set_id = :zoneSetId GROUP BY z.id`,
    { ids: `{${(sightingIds ?? []).join(',')}}`, fieldId: zoneSet.fieldId, pestId: zoneSet.pestId, zoneSetId: zoneSet.id },
  );
}

export interface ZoneCountRow {
  zone_id: string;
  /** Live sightings with a count inside the zone, empty stops (count 0) included. */
  counted: number;
  /** Their mean count, null when none has a count. */
  mean_count: number | null;
}

/** The mean count per counted sighting inside each zone of a set: the check's own sightings when their ids are given, else the field's of the pest. */
export const zoneMeanCounts = (params: { zoneSetId: string; sightingIds: string[] | null; fieldId: string; pestId: string }, options: InTransaction = {}) =>
  selectRows<ZoneCountRow>(
    `SELECT z.id AS zone_id, count(s.id)::int AS counted, avg(s.count)::float8 AS mean_count
       FROM zones z
       LEFT JOIN sightings s ON s.field_id = :fieldId AND s.pest_id = :pestId AND ${liveSighting('s')} AND s.count IS NOT NULL
             AND (CAST(:ids AS uuid[]) IS NULL OR s.id = ANY(CAST(:ids AS uuid[]))) AND ST_Covers(z.geometry, s.position)
      WHERE z.zone_set_id = :zoneSetId
      GROUP BY z.id`,
    { zoneSetId: params.zoneSetId, ids: params.sightingIds ? `{${params.sightingIds.join(',')}}` : null, fieldId: params.fieldId, pestId: params.pestId },
    options,
  );
