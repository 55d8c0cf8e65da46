// Where a point lies relative to field boundaries (PostGIS): inside which field, or how far outside.
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../db.ts';
import type { Position, NearestField } from '../../shared/schemas/sightings.ts';

/** A point just outside a boundary within this distance is offered that field (GPS error, headland photos). */
export const NEAREST_FIELD_MARGIN_M = 50;

export async function fieldContains(fieldId: string, position: Position, transaction?: Transaction) {
  const [row] = await sequelize.query<{ inside: boolean }>(
    'SELECT ST_Contains(boundary, ST_SetSRID(ST_MakePoint(:lon, :lat), 4326)) AS inside FROM fields WHERE id = :fieldId',
    { replacements: { fieldId, ...position }, type: QueryTypes.SELECT, transaction },
  );
  return row?.inside === true;
}

/** Fields of the organisation containing the point; assignedTo limits them to one scout's fields. */
export async function fieldsContaining(organisationId: string, position: Position, fieldIds: string[] | null) {
  if (fieldIds && fieldIds.length === 0) return [];
  return sequelize.query<{ id: string; name: string }>(
    `SELECT id, name FROM fields
      WHERE organisation_id = :org ${fieldIds ? 'AND id IN (:fieldIds)' : ''}
        AND ST_Contains(boundary, ST_SetSRID(ST_MakePoint(:lon, :lat), 4326))
      ORDER BY season DESC, area_m2 ASC`,
    { replacements: { org: organisationId, fieldIds, ...position }, type: QueryTypes.SELECT },
  );
}

/** The nearest of the given fields within the margin (geodesic metres), or null. */
export async function nearestField(
  organisationId: string,
  position: Position,
  fieldIds: string[] | null,
  marginM = NEAREST_FIELD_MARGIN_M,
): Promise<NearestField | null> {
  if (fieldIds && fieldIds.length === 0) return null;
  const [row] = await sequelize.query<NearestField>(
    `SELECT id, name, ST_Distance(boundary::geography, ST_SetSRID(ST_MakePoint(:lon, :lat), 4326)::geography) AS "distanceM"
       FROM fields
      WHERE organisation_id = :org ${fieldIds ? 'AND id IN (:fieldIds)' : ''}
        AND ST_DWithin(boundary::geography, ST_SetSRID(ST_MakePoint(:lon, :lat), 4326)::geography, :marginM)
      ORDER BY "distanceM" ASC LIMIT 1`,
    { replacements: { org: organisationId, fieldIds, marginM, ...position }, type: QueryTypes.SELECT },
  );
  return row ? { ...row, distanceM: Math.round(row.distanceM * 10) / 10 } : null;
}
