import type { MultiPolygon } from 'geojson';
import { execute, selectRow, selectRows, type InTransaction } from './sql.ts';

export interface FieldRow {
  id: string;
  organisationId: string;
  farmId: string;
  name: string;
  crop: string;
  season: number;
  /** As the driver reads it: GeoJSON, with a `crs` member. */
  boundary: MultiPolygon;
  /** Set by the database trigger on every save (ellipsoidal area). */
  areaM2: number;
}

const FIELD_COLUMNS = 'id, organisation_id AS "organisationId", farm_id AS "farmId", name, crop, season, boundary, area_m2 AS "areaM2"';

const asGeometry = 'ST_Multi(ST_SetSRID(ST_GeomFromGeoJSON(:geojson), 4326))';

/** The organisation's fields by name: only those in `ids` when given, only one farm's when `farmId` is. */
export const listFieldsOfOrganisation = (organisationId: string, ids: string[] | null, farmId: string | undefined, options: InTransaction = {}) =>
  ids && !ids.length
    ? Promise.resolve([])
    : selectRows<FieldRow>(
        `SELECT ${FIELD_COLUMNS} FROM fields WHERE organisation_id = :organisationId${ids ? ' AND id IN (:ids)' : ''}${farmId ? ' AND farm_id = :farmId' : ''} ORDER BY name ASC`,
        { organisationId, ids, farmId },
        options,
      );

export const findFieldInOrganisation = (organisationId: string, id: string, options: InTransaction = {}) =>
  selectRow<FieldRow>(`SELECT ${FIELD_COLUMNS} FROM fields WHERE id = :id AND organisation_id = :organisationId`, { id, organisationId }, options);

export const findFieldBoundary = (id: string, options: InTransaction = {}) =>
  selectRow<Pick<FieldRow, 'id' | 'boundary'>>('SELECT id, boundary FROM fields WHERE id = :id', { id }, options);

export const countFieldsOfFarm = async (farmId: string, options: InTransaction = {}) =>
  (await selectRow<{ n: number }>('SELECT count(*)::int AS n FROM fields WHERE farm_id = :farmId', { farmId }, options))!.n;

export interface NewField {
  organisationId: string;
  farmId: string;
  name: string;
  crop: string;
  season: number;
  boundary: MultiPolygon;
}

export const insertField = async (field: NewField, options: InTransaction = {}) =>
  (await selectRow<{ id: string }>(
    `INSERT INTO fields (organisation_id, farm_id, name, crop, season, boundary)
       VALUES (:org, :farmId, :name, :crop, :season, ${asGeometry}) RETURNING id`,
    { org: field.organisationId, farmId: field.farmId, name: field.name, crop: field.crop, season: field.season, geojson: JSON.stringify(field.boundary) },
    options,
  ))!.id;

export interface FieldDetails {
  name?: string;
  crop?: string;
  season?: number;
}

/** Writes the details given (the others stay as they are). */
export async function updateFieldDetails(id: string, details: FieldDetails, options: InTransaction = {}) {
  const keys = (['name', 'crop', 'season'] as const).filter((k) => details[k] !== undefined);
  if (!keys.length) return;
  await execute(`UPDATE fields SET ${keys.map((k) => `${k} = :${k}`).join(', ')}, updated_at = now() WHERE id = :id`, { ...details, id }, options);
}

export const updateFieldBoundary = (id: string, boundary: MultiPolygon, options: InTransaction = {}) =>
  execute(`UPDATE fields SET boundary = ${asGeometry}, updated_at = now() WHERE id = :id`, { geojson: JSON.stringify(boundary), id }, options);

export const deleteField = (id: string, options: InTransaction = {}) => execute('DELETE FROM fields WHERE id = :id', { id }, options);

/** What a field holds on record (live or pending sightings not deleted, notices of any state). */
export const findFieldRecord = async (id: string, options: InTransaction = {}) =>
  (await selectRow<{ sightings: number; notices: number }>(
    `SELECT (SELECT count(*)::int FROM sightings WHERE field_id = :id AND deleted_at IS NULL) AS sightings,
              (SELECT count(*)::int FROM notices WHERE field_id = :id) AS notices`,
    { id },
    options,
  ))!;

/** Ids of the organisation's fields a scout is assigned to. */
export const listFieldIdsOfScout = async (organisationId: string, userId: string) =>
  (
    await selectRows<{ id: string }>(
      `SELECT f.id FROM fields f JOIN field_assignments a ON a.field_id = f.id WHERE a.user_id = :userId AND f.organisation_id = :org`,
      { userId, org: organisationId },
    )
  ).map((r) => r.id);

/** Ids of the organisation's fields on the farms a grower is linked to. */
export const listFieldIdsOfGrower = async (organisationId: string, userId: string) =>
  (
    await selectRows<{ id: string }>(
      `SELECT f.id FROM fields f JOIN farm_growers g ON g.farm_id = f.farm_id WHERE g.user_id = :userId AND f.organisation_id = :org`,
      { userId, org: organisationId },
    )
  ).map((r) => r.id);

export const findFieldRefInOrganisation = (organisationId: string, fieldId: string, options: InTransaction = {}) =>
  selectRow<{ id: string; name: string }>(
    'SELECT id, name FROM fields WHERE id = :fieldId AND organisation_id = :org',
    { fieldId, org: organisationId },
    options,
  );

export const findFieldName = async (fieldId: string) => (await selectRow<{ name: string }>('SELECT name FROM fields WHERE id = :fieldId', { fieldId }))?.name;

/** Takes the field's row lock until the transaction ends (one writer of its zone set versions at a time). */
export const lockField = (fieldId: string, options: InTransaction) => execute('SELECT id FROM fields WHERE id = :fieldId FOR UPDATE', { fieldId }, options);

export interface Position {
  lon: number;
  lat: number;
}

export const fieldContainsPoint = async (fieldId: string, position: Position, options: InTransaction = {}) =>
  (
    await selectRow<{ inside: boolean }>(
      'SELECT ST_Contains(boundary, ST_SetSRID(ST_MakePoint(:lon, :lat), 4326)) AS inside FROM fields WHERE id = :fieldId',
      { fieldId, lon: position.lon, lat: position.lat },
      options,
    )
  )?.inside === true;

/** Fields of the organisation containing the point (only those in `fieldIds` when given), latest season and smallest first. */
export const listFieldsContainingPoint = (organisationId: string, position: Position, fieldIds: string[] | null) =>
  selectRows<{ id: string; name: string }>(
    `SELECT id, name FROM fields
      WHERE organisation_id = :org ${fieldIds ? 'AND id IN (:fieldIds)' : ''}
        AND ST_Contains(boundary, ST_SetSRID(ST_MakePoint(:lon, :lat), 4326))
      ORDER BY season DESC, area_m2 ASC`,
    { org: organisationId, fieldIds, lon: position.lon, lat: position.lat },
  );

/** The nearest of the fields within the margin (geodesic metres), with its distance. */
export const findNearestFieldWithin = (organisationId: string, position: Position, fieldIds: string[] | null, marginM: number) =>
  selectRow<{ id: string; name: string; distanceM: number }>(
    `SELECT id, name, ST_Distance(boundary::geography, ST_SetSRID(ST_MakePoint(:lon, :lat), 4326)::geography) AS "distanceM"
       FROM fields
      WHERE organisation_id = :org ${fieldIds ? 'AND id IN (:fieldIds)' : ''}
        AND ST_DWithin(boundary::geography, ST_SetSRID(ST_MakePoint(:lon, :lat), 4326)::geography, :marginM)
      ORDER BY "distanceM" ASC LIMIT 1`,
    { org: organisationId, fieldIds, marginM, lon: position.lon, lat: position.lat },
  );
