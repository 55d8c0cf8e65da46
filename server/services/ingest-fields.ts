// Where a point lies relative to field boundaries (PostGIS): inside which field, or how far outside.
import type { Transaction } from 'sequelize';
import { fieldContainsPoint, findNearestFieldWithin, listFieldsContainingPoint } from '../queries/fields.ts';
import type { Position, NearestField } from '../../shared/schemas/sightings.ts';

/** A point just outside a boundary within this distance is offered that field (GPS error, headland photos). */
export const NEAREST_FIELD_MARGIN_M = 50;

export async function fieldContains(fieldId: string, position: Position, transaction?: Transaction) {
  return fieldContainsPoint(fieldId, position, { transaction });
}

/** Fields of the organisation containing the point; assignedTo limits them to one scout's fields. */
export async function fieldsContaining(organisationId: string, position: Position, fieldIds: string[] | null) {
  if (fieldIds && fieldIds.length === 0) return [];
  return listFieldsContainingPoint(organisationId, position, fieldIds);
}

/** The nearest of the given fields within the margin (geodesic metres), or null. */
export async function nearestField(
  organisationId: string,
  position: Position,
  fieldIds: string[] | null,
  marginM = NEAREST_FIELD_MARGIN_M,
): Promise<NearestField | null> {
  if (fieldIds && fieldIds.length === 0) return null;
  const row = await findNearestFieldWithin(organisationId, position, fieldIds, marginM);
  return row ? { ...row, distanceM: Math.round(row.distanceM * 10) / 10 } : null;
}
