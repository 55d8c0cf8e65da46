import { Op } from 'sequelize';
import { sequelize } from '../db.ts';
import { Farm } from '../models/farm.ts';
import { FarmContact } from '../models/farm-contact.ts';
import { Field } from '../models/field.ts';
import { FarmGrower } from '../models/farm-grower.ts';
import { User } from '../models/user.ts';
import '../models/associations.ts';
import type { Actor } from '../auth/passport.ts';
import type { FarmInput, FarmView } from '../../shared/schemas/farms.ts';
import { badRequest, conflict, notFound } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { visibleFarmIds } from './scope.ts';

function present(farm: Farm, actor: Actor): FarmView {
  const showContacts = actor.role === 'admin' || actor.role === 'adviser' || actor.role === 'grower';
  return {
    id: farm.id,
    name: farm.name,
    contacts: showContacts ? (farm.contacts ?? []).map((c) => ({ id: c.id, name: c.name, email: c.email })) : [],
  };
}

export async function listFarms(actor: Actor) {
  const ids = await visibleFarmIds(actor);
  const farms = await Farm.findAll({
    where: { organisationId: actor.organisationId, ...(ids ? { id: { [Op.in]: ids } } : {}) },
    include: [{ model: FarmContact, as: 'contacts' }],
    order: [
      ['name', 'ASC'],
      [{ model: FarmContact, as: 'contacts' }, 'name', 'ASC'],
    ],
  });
  return farms.map((f) => present(f, actor));
}

export async function getFarm(actor: Actor, id: string) {
  const ids = await visibleFarmIds(actor);
  if (ids && !ids.includes(id)) throw notFound('That farm');
  const farm = await Farm.findOne({ where: { id, organisationId: actor.organisationId }, include: [{ model: FarmContact, as: 'contacts' }] });
  if (!farm) throw notFound('That farm');
  const growers = await FarmGrower.findAll({ where: { farmId: id } });
  return { ...present(farm, actor), growerUserIds: actor.role === 'admin' ? growers.map((g) => g.userId) : undefined };
}

export async function createFarm(actor: Actor, input: FarmInput) {
  const farm = await sequelize.transaction(async (transaction) => {
    const farm = await Farm.create({ organisationId: actor.organisationId, name: input.name }, { transaction });
    await FarmContact.bulkCreate(
      input.contacts.map((c) => ({ ...c, farmId: farm.id })),
      { transaction },
    );
    await recordAudit(actor, 'create', 'farm', farm.id, input, transaction);
    return farm;
  });
  return getFarm(actor, farm.id);
}

export async function updateFarm(actor: Actor, id: string, input: FarmInput) {
  await sequelize.transaction(async (transaction) => {
    const farm = await Farm.findOne({ where: { id, organisationId: actor.organisationId }, transaction });
    if (!farm) throw notFound('That farm');
    await farm.update({ name: input.name }, { transaction });
    // Contacts are replaced as a set: the form always sends the whole list.
    await FarmContact.destroy({ where: { farmId: id }, transaction });
    await FarmContact.bulkCreate(
      input.contacts.map((c) => ({ ...c, farmId: id })),
      { transaction },
    );
    await recordAudit(actor, 'update', 'farm', id, input, transaction);
  });
  return getFarm(actor, id);
}

export async function deleteFarm(actor: Actor, id: string) {
  await sequelize.transaction(async (transaction) => {
    const farm = await Farm.findOne({ where: { id, organisationId: actor.organisationId }, transaction });
    if (!farm) throw notFound('That farm');
    // Deleting a farm would take its fields and their scouting records with it: its fields go first, one by one.
    const fields = await Field.count({ where: { farmId: id }, transaction });
    if (fields > 0)
      throw conflict(`${farm.name} still has ${fields} ${fields === 1 ? 'field' : 'fields'}; delete ${fields === 1 ? 'it' : 'them'} first, then the farm.`);
    await farm.destroy({ transaction });
    await recordAudit(actor, 'delete', 'farm', id, { name: farm.name }, transaction);
  });
}

export async function linkGrower(actor: Actor, farmId: string, userId: string) {
  const farm = await Farm.findOne({ where: { id: farmId, organisationId: actor.organisationId } });
  if (!farm) throw notFound('That farm');
  const user = await User.findOne({ where: { id: userId, organisationId: actor.organisationId } });
  if (!user) throw notFound('That user');
  if (user.role !== 'grower') throw badRequest(`${user.name} is not a grower; only grower accounts are linked to farms.`);
  await sequelize.transaction(async (transaction) => {
    await FarmGrower.findOrCreate({ where: { farmId, userId }, transaction });
    await recordAudit(actor, 'link-grower', 'farm', farmId, { userId }, transaction);
  });
}

export async function unlinkGrower(actor: Actor, farmId: string, userId: string) {
  const farm = await Farm.findOne({ where: { id: farmId, organisationId: actor.organisationId } });
  if (!farm) throw notFound('That farm');
  await sequelize.transaction(async (transaction) => {
    await FarmGrower.destroy({ where: { farmId, userId }, transaction });
    await recordAudit(actor, 'unlink-grower', 'farm', farmId, { userId }, transaction);
  });
}
