import { sequelize } from '../db.ts';
import * as farms from '../queries/farms.ts';
import { deleteContactsOfFarm, insertContacts, listContactsOfFarm, listContactsOfFarms, type FarmContactRow } from '../queries/farm-contacts.ts';
import { countFieldsOfFarm } from '../queries/fields.ts';
import { deleteFarmGrower, insertFarmGrower, listGrowerIdsOfFarm } from '../queries/farm-growers.ts';
import { findUserInOrganisation } from '../queries/users.ts';
import type { Actor } from '../auth/passport.ts';
import type { FarmInput, FarmView } from '../../shared/schemas/farms.ts';
import { badRequest, conflict, notFound } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { visibleFarmIds } from './scope.ts';

function present(farm: farms.FarmRow & { contacts: FarmContactRow[] }, actor: Actor): FarmView {
  const showContacts = actor.role === 'admin' || actor.role === 'adviser' || actor.role === 'grower';
  return {
    id: farm.id,
    name: farm.name,
    contacts: showContacts ? farm.contacts.map((c) => ({ id: c.id, name: c.name, email: c.email })) : [],
  };
}

export async function listFarms(actor: Actor) {
  const ids = await visibleFarmIds(actor);
  const found = await farms.listFarmsOfOrganisation(actor.organisationId, ids);
  const contacts = await listContactsOfFarms(found.map((f) => f.id));
  return found.map((f) => present({ ...f, contacts: contacts.filter((c) => c.farmId === f.id) }, actor));
}

export async function getFarm(actor: Actor, id: string) {
  const ids = await visibleFarmIds(actor);
  if (ids && !ids.includes(id)) throw notFound('That farm');
  const farm = await farms.findFarmInOrganisation(actor.organisationId, id);
  if (!farm) throw notFound('That farm');
  const contacts = await listContactsOfFarm(id);
  const growerUserIds = await listGrowerIdsOfFarm(id);
  return { ...present({ ...farm, contacts }, actor), growerUserIds: actor.role === 'admin' ? growerUserIds : undefined };
}

export async function createFarm(actor: Actor, input: FarmInput) {
  const farm = await sequelize.transaction(async (transaction) => {
    const farm = await farms.insertFarm({ organisationId: actor.organisationId, name: input.name }, { transaction });
    await insertContacts(farm.id, input.contacts, { transaction });
    await recordAudit(actor, 'create', 'farm', farm.id, input, transaction);
    return farm;
  });
  return getFarm(actor, farm.id);
}

export async function updateFarm(actor: Actor, id: string, input: FarmInput) {
  await sequelize.transaction(async (transaction) => {
    const farm = await farms.findFarmInOrganisation(actor.organisationId, id, { transaction });
    if (!farm) throw notFound('That farm');
    await farms.renameFarm(id, input.name, { transaction });
    // Contacts are replaced as a set: the form always sends the whole list.
    await deleteContactsOfFarm(id, { transaction });
    await insertContacts(id, input.contacts, { transaction });
    await recordAudit(actor, 'update', 'farm', id, input, transaction);
  });
  return getFarm(actor, id);
}

export async function deleteFarm(actor: Actor, id: string) {
  await sequelize.transaction(async (transaction) => {
    const farm = await farms.findFarmInOrganisation(actor.organisationId, id, { transaction });
    if (!farm) throw notFound('That farm');
    // Deleting a farm would take its fields and their scouting records with it: its fields go first, one by one.
    const fields = await countFieldsOfFarm(id, { transaction });
    if (fields > 0)
      throw conflict(`${farm.name} still has ${fields} ${fields === 1 ? 'field' : 'fields'}; delete ${fields === 1 ? 'it' : 'them'} first, then the farm.`);
    await farms.deleteFarm(id, { transaction });
    await recordAudit(actor, 'delete', 'farm', id, { name: farm.name }, transaction);
  });
}

export async function linkGrower(actor: Actor, farmId: string, userId: string) {
  const farm = await farms.findFarmInOrganisation(actor.organisationId, farmId);
  if (!farm) throw notFound('That farm');
  const user = await findUserInOrganisation(actor.organisationId, userId);
  if (!user) throw notFound('That user');
  if (user.role !== 'grower') throw badRequest(`${user.name} is not a grower; only grower accounts are linked to farms.`);
  await sequelize.transaction(async (transaction) => {
    await insertFarmGrower(farmId, userId, { transaction });
    await recordAudit(actor, 'link-grower', 'farm', farmId, { userId }, transaction);
  });
}

export async function unlinkGrower(actor: Actor, farmId: string, userId: string) {
  const farm = await farms.findFarmInOrganisation(actor.organisationId, farmId);
  if (!farm) throw notFound('That farm');
  await sequelize.transaction(async (transaction) => {
    await deleteFarmGrower(farmId, userId, { transaction });
    await recordAudit(actor, 'unlink-grower', 'farm', farmId, { userId }, transaction);
  });
}
