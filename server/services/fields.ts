import type { MultiPolygon } from 'geojson';
import { sequelize } from '../db.ts';
import * as fields from '../queries/fields.ts';
import { findFarmInOrganisation, findFarmNames } from '../queries/farms.ts';
import { deleteFieldAssignment, insertFieldAssignment, listAssignmentsOfFields } from '../queries/field-assignments.ts';
import { findUserInOrganisation } from '../queries/users.ts';
import type { Actor } from '../auth/passport.ts';
import type { FieldCreateInput, FieldAnswer } from '../../shared/schemas/fields.ts';
import { badRequest, conflict, notFound } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { visibleFieldIds } from './scope.ts';
import { readBoundary } from './boundary-input.ts';

export type FieldSummary = FieldAnswer;

const stripCrs = (g: MultiPolygon & { crs?: unknown }): MultiPolygon => ({ type: 'MultiPolygon', coordinates: g.coordinates });

async function present(rows: fields.FieldRow[], actor: Actor): Promise<FieldSummary[]> {
  const farms = await findFarmNames([...new Set(rows.map((f) => f.farmId))]);
  const farmNames = new Map(farms.map((f) => [f.id, f.name]));
  const assignments = actor.role === 'admin' || actor.role === 'adviser' ? await listAssignmentsOfFields(rows.map((f) => f.id)) : [];
  return rows.map((f) => ({
    id: f.id,
    farmId: f.farmId,
    farmName: farmNames.get(f.farmId) ?? '',
    name: f.name,
    crop: f.crop,
    season: f.season,
    areaM2: f.areaM2,
    boundary: stripCrs(f.boundary),
    ...(assignments.length || actor.role === 'admin' || actor.role === 'adviser'
      ? { scoutIds: assignments.filter((a) => a.fieldId === f.id).map((a) => a.userId) }
      : {}),
  }));
}

export async function listFields(actor: Actor, filter: { farmId?: string } = {}) {
  const ids = await visibleFieldIds(actor);
  return present(await fields.listFieldsOfOrganisation(actor.organisationId, ids, filter.farmId), actor);
}

export async function findVisibleField(actor: Actor, id: string) {
  const ids = await visibleFieldIds(actor);
  if (ids && !ids.includes(id)) throw notFound('That field');
  const field = await fields.findFieldInOrganisation(actor.organisationId, id);
  if (!field) throw notFound('That field');
  return field;
}

export async function getField(actor: Actor, id: string) {
  const [view] = await present([await findVisibleField(actor, id)], actor);
  return view;
}

async function assertOwnFarm(actor: Actor, farmId: string) {
  const farm = await findFarmInOrganisation(actor.organisationId, farmId);
  if (!farm) throw badRequest('Choose one of your own farms for this field.', { farmId: 'Choose one of your own farms for this field.' });
}

export async function createField(actor: Actor, input: FieldCreateInput) {
  await assertOwnFarm(actor, input.farmId);
  const boundary = await readBoundary(input);
  const id = await sequelize.transaction(async (transaction) => {
    const id = await fields.insertField(
      { organisationId: actor.organisationId, farmId: input.farmId, name: input.name, crop: input.crop, season: input.season, boundary },
      { transaction },
    );
    await recordAudit(actor, 'create', 'field', id, { name: input.name, farmId: input.farmId, crop: input.crop, season: input.season }, transaction);
    return id;
  });
  return getField(actor, id);
}

export async function updateField(actor: Actor, id: string, input: Partial<FieldCreateInput>) {
  await findVisibleField(actor, id);
  const boundary = input.boundary !== undefined || input.boundaryFile !== undefined ? await readBoundary(input) : null;
  await sequelize.transaction(async (transaction) => {
    const details = Object.fromEntries(Object.entries({ name: input.name, crop: input.crop, season: input.season }).filter(([, v]) => v !== undefined));
    if (Object.keys(details).length) await fields.updateFieldDetails(id, details, { transaction });
    if (boundary) await fields.updateFieldBoundary(id, boundary, { transaction });
    await recordAudit(actor, 'update', 'field', id, { ...details, ...(boundary ? { boundary: 'replaced' } : {}) }, transaction);
  });
  return getField(actor, id);
}

const counted = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * A field's scouting record (sightings, notices sent to the grower) outlives mistakes in its set-up, so a field
 * holding one is not deleted; its boundary and details can still be edited.
 */
export async function deleteField(actor: Actor, id: string) {
  const field = await findVisibleField(actor, id);
  await sequelize.transaction(async (transaction) => {
    const record = await fields.findFieldRecord(id, { transaction });
    const held = [
      record.sightings && counted(record.sightings, 'sighting', 'sightings'),
      record.notices && counted(record.notices, 'zone notice', 'zone notices'),
    ].filter(Boolean);
    if (held.length) throw conflict(`${field.name} has ${held.join(' and ')} on record, so it is kept; edit its boundary or details instead of deleting it.`);
    await fields.deleteField(id, { transaction });
    await recordAudit(actor, 'delete', 'field', id, { name: field.name }, transaction);
  });
}

export async function assignScout(actor: Actor, fieldId: string, userId: string) {
  await findVisibleField(actor, fieldId);
  const user = await findUserInOrganisation(actor.organisationId, userId);
  if (!user) throw notFound('That user');
  if (user.role !== 'scout') throw badRequest(`${user.name} is not a scout; only scouts are assigned to fields.`);
  await sequelize.transaction(async (transaction) => {
    await insertFieldAssignment(fieldId, userId, { transaction });
    await recordAudit(actor, 'assign-scout', 'field', fieldId, { userId }, transaction);
  });
}

export async function unassignScout(actor: Actor, fieldId: string, userId: string) {
  await findVisibleField(actor, fieldId);
  await sequelize.transaction(async (transaction) => {
    await deleteFieldAssignment(fieldId, userId, { transaction });
    await recordAudit(actor, 'unassign-scout', 'field', fieldId, { userId }, transaction);
  });
}
