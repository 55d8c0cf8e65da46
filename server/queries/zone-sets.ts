import type { ZoneSetStatus, ZoneSetView } from '../../shared/schemas/zones.ts';
import { execute, selectRow, selectRows, type InTransaction } from './sql.ts';

/** The next version number of a field's zones for one pest (the caller holds the field's lock). */
export const nextZoneSetVersion = async (fieldId: string, pestId: string, options: InTransaction = {}) =>
  (await selectRow<{ next: number }>(
    'SELECT COALESCE(MAX(version), 0) + 1 AS next FROM zone_sets WHERE field_id = :fieldId AND pest_id = :pestId',
    { fieldId, pestId },
    options,
  ))!.next;

/** The accepted version of a field's zones for one pest becomes superseded. */
export const supersedeAcceptedZoneSets = (fieldId: string, pestId: string, options: InTransaction = {}) =>
  execute(
    `UPDATE zone_sets SET status = 'superseded', updated_at = now() WHERE field_id = :fieldId AND pest_id = :pestId AND status = 'accepted'`,
    { fieldId, pestId },
    options,
  );

export interface NewZoneSet {
  organisationId: string;
  fieldId: string;
  checkId: string | null;
  pestId: string;
  version: number;
  status: ZoneSetStatus;
  createdBy: string;
  acceptedAt: Date | null;
}

export const insertZoneSet = async (zoneSet: NewZoneSet, options: InTransaction = {}) =>
  (await selectRow<{ id: string }>(
    `INSERT INTO zone_sets (organisation_id, field_id, check_id, pest_id, version, status, created_by, accepted_at)
     VALUES (:organisationId, :fieldId, :checkId, :pestId, :version, :status, :createdBy, :acceptedAt) RETURNING id`,
    { ...zoneSet },
    options,
  ))!.id;

export interface ZoneSetRow {
  id: string;
  field_id: string;
  pest_id: string;
  pest_name: string;
  check_id: string | null;
  version: number;
  status: ZoneSetView['status'];
  created_by: string;
  created_by_name: string;
  created_at: Date;
  accepted_at: Date | null;
  field_name: string;
  field_area_m2: number;
  treated_m2: number | null;
  zone_count: number;
}

const zoneSetColumns = `zs.id, zs.field_id, zs.pest_id, p.name AS pest_name, zs.check_id, zs.version, zs.status, zs.created_by,
  u.name AS created_by_name, zs.created_at, zs.accepted_at, f.name AS field_name, f.area_m2 AS field_area_m2,
  (SELECT ST_Area(ST_Union(z.geometry)::geography, true) FROM zones z WHERE z.zone_set_id = zs.id) AS treated_m2,
  (SELECT count(*) FROM zones z WHERE z.zone_set_id = zs.id)::int AS zone_count`;
const zoneSetFrom = `zone_sets zs JOIN pests p ON p.id = zs.pest_id JOIN users u ON u.id = zs.created_by JOIN fields f ON f.id = zs.field_id`;

/** A field's zone sets by pest name, newest version first. */
export const listZoneSetsOfField = (organisationId: string, fieldId: string) =>
  selectRows<ZoneSetRow>(
    `SELECT ${zoneSetColumns} FROM ${zoneSetFrom} WHERE zs.field_id = :fieldId AND zs.organisation_id = :org ORDER BY p.name, zs.version DESC`,
    {
      fieldId,
      org: organisationId,
    },
  );

export const findZoneSetInOrganisation = (organisationId: string, id: string) =>
  selectRow<ZoneSetRow>(`SELECT ${zoneSetColumns} FROM ${zoneSetFrom} WHERE zs.id = :id AND zs.organisation_id = :org`, { id, org: organisationId });

export interface ZoneSetFileFacts {
  farm_name: string;
  field_area_m2: number;
  /** GeoJSON text, outer rings counter-clockwise. */
  boundary: string;
  count_unit: string;
  action_threshold: number;
  threshold_source: string;
  sighting_ids: string[] | null;
}

/** What the zone files need beyond the zone set itself: the farm, the field boundary, the pest's threshold, the check's sightings. */
export const findZoneSetFileFacts = async (id: string) =>
  (await selectRow<ZoneSetFileFacts>(
    `SELECT fa.name AS farm_name, f.area_m2 AS field_area_m2, ST_AsGeoJSON(ST_ForcePolygonCCW(f.boundary), 9) AS boundary,
            p.count_unit, p.action_threshold, p.threshold_source, pc.sighting_ids
       FROM zone_sets zs JOIN fields f ON f.id = zs.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = zs.pest_id
       LEFT JOIN pattern_checks pc ON pc.id = zs.check_id
      WHERE zs.id = :id`,
    { id },
  ))!;

export interface ZoneSetRef {
  id: string;
  fieldId: string;
  checkId: string | null;
  pestId: string;
  version: number;
  status: ZoneSetStatus;
}

export const findZoneSetRefInOrganisation = (organisationId: string, id: string) =>
  selectRow<ZoneSetRef>(
    `SELECT id, field_id AS "fieldId", check_id AS "checkId", pest_id AS "pestId", version, status FROM zone_sets WHERE id = :id AND organisation_id = :org`,
    { id, org: organisationId },
  );
