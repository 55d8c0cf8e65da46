import { Op, QueryTypes } from 'sequelize';
import type { MultiPolygon } from 'geojson';
import { sequelize } from '../db.ts';
import { Field } from '../models/field.ts';
import { Farm } from '../models/farm.ts';
import { FieldAssignment } from '../models/field-assignment.ts';
import { User } from '../models/user.ts';
import '../models/associations.ts';
import type { Actor } from '../auth/passport.ts';
import type { FieldCreateInput, FieldAnswer } from '../../shared/schemas/fields.ts';
import { badRequest, conflict, notFound } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { visibleFieldIds } from './scope.ts';
import { readBoundary } from './boundary-input.ts';

export type FieldSummary = FieldAnswer;

const stripCrs = (g: MultiPolygon & { crs?: unknown }): MultiPolygon => ({ type: 'MultiPolygon', coordinates: g.coordinates });

async function present(fields: Field[], actor: Actor): Promise<FieldSummary[]> {
  const farms = await Farm.findAll({ where: { id: { [Op.in]: [...new Set(fields.map((f) => f.farmId))] } } });
  const farmNames = new Map(farms.map((f) => [f.id, f.name]));
  const assignments =
    actor.role === 'admin' || actor.role === 'adviser' ? await FieldAssignment.findAll({ where: { fieldId: { [Op.in]: fields.map((f) => f.id) } } }) : [];
  return fields.map((f) => ({
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
  const fields = await Field.findAll({
    where: {
      organisationId: actor.organisationId,
      ...(ids ? { id: { [Op.in]: ids } } : {}),
      ...(filter.farmId ? { farmId: filter.farmId } : {}),
    },
    order: [['name', 'ASC']],
  });
  return present(fields, actor);
}

export async function findVisibleField(actor: Actor, id: string) {
  const ids = await visibleFieldIds(actor);
  if (ids && !ids.includes(id)) throw notFound('That field');
  const field = await Field.findOne({ where: { id, organisationId: actor.organisationId } });
  if (!field) throw notFound('That field');
  return field;
}

export async function getField(actor: Actor, id: string) {
  const [view] = await present([await findVisibleField(actor, id)], actor);
  return view;
}

async function assertOwnFarm(actor: Actor, farmId: string) {
  const farm = await Farm.findOne({ where: { id: farmId, organisationId: actor.organisationId } });
  if (!farm) throw badRequest('Choose one of your own farms for this field.', { farmId: 'Choose one of your own farms for this field.' });
}

async function saveBoundary(fieldId: string, boundary: MultiPolygon, transaction: import('sequelize').Transaction) {
  await sequelize.query(`UPDATE fields SET boundary = ST_Multi(ST_SetSRID(ST_GeomFromGeoJSON(:geojson), 4326)), updated_at = now() WHERE id = :id`, {
    replacements: { geojson: JSON.stringify(boundary), id: fieldId },
    type: QueryTypes.UPDATE,
    transaction,
  });
}

export async function createField(actor: Actor, input: FieldCreateInput) {
  await assertOwnFarm(actor, input.farmId);
  const boundary = await readBoundary(input);
  const id = await sequelize.transaction(async (transaction) => {
    const [row] = await sequelize.query<{ id: string }>(
      `INSERT INTO fields (organisation_id, farm_id, name, crop, season, boundary)
       VALUES (:org, :farmId, :name, :crop, :season, ST_Multi(ST_SetSRID(ST_GeomFromGeoJSON(:geojson), 4326))) RETURNING id`,
      {
        replacements: {
          org: actor.organisationId,
          farmId: input.farmId,
          name: input.name,
          crop: input.crop,
          season: input.season,
          geojson: JSON.stringify(boundary),
        },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    await recordAudit(actor, 'create', 'field', row.id, { name: input.name, farmId: input.farmId, crop: input.crop, season: input.season }, transaction);
    return row.id;
  });
  return getField(actor, id);
}

export async function updateField(actor: Actor, id: string, input: Partial<FieldCreateInput>) {
  const field = await findVisibleField(actor, id);
  const boundary = input.boundary !== undefined || input.boundaryFile !== undefined ? await readBoundary(input) : null;
  await sequelize.transaction(async (transaction) => {
    const details = Object.fromEntries(Object.entries({ name: input.name, crop: input.crop, season: input.season }).filter(([, v]) => v !== undefined));
    if (Object.keys(details).length) await field.update(details, { transaction });
    if (boundary) await saveBoundary(id, boundary, transaction);
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
    const [record] = await sequelize.query<{ sightings: number; notices: number }>(
      `SELECT (SELECT count(*)::int FROM sightings WHERE field_id = :id AND deleted_at IS NULL) AS sightings,
              (SELECT count(*)::int FROM notices WHERE field_id = :id) AS notices`,
      { replacements: { id }, type: QueryTypes.SELECT, transaction },
    );
    const held = [
      record.sightings && counted(record.sightings, 'sighting', 'sightings'),
      record.notices && counted(record.notices, 'zone notice', 'zone notices'),
    ].filter(Boolean);
    if (held.length) throw conflict(`${field.name} has ${held.join(' and ')} on record, so it is kept; edit its boundary or details instead of deleting it.`);
    await field.destroy({ transaction });
    await recordAudit(actor, 'delete', 'field', id, { name: field.name }, transaction);
  });
}

export async function assignScout(actor: Actor, fieldId: string, userId: string) {
  await findVisibleField(actor, fieldId);
  const user = await User.findOne({ where: { id: userId, organisationId: actor.organisationId } });
  if (!user) throw notFound('That user');
  if (user.role !== 'scout') throw badRequest(`${user.name} is not a scout; only scouts are assigned to fields.`);
  await sequelize.transaction(async (transaction) => {
    await FieldAssignment.findOrCreate({ where: { fieldId, userId }, transaction });
    await recordAudit(actor, 'assign-scout', 'field', fieldId, { userId }, transaction);
  });
}

export async function unassignScout(actor: Actor, fieldId: string, userId: string) {
  await findVisibleField(actor, fieldId);
  await sequelize.transaction(async (transaction) => {
    await FieldAssignment.destroy({ where: { fieldId, userId }, transaction });
    await recordAudit(actor, 'unassign-scout', 'field', fieldId, { userId }, transaction);
  });
}
