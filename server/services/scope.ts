// Which farms and fields a signed-in person may see. Every query in the services goes through these,
// so another organisation's ids (guessed or not) simply find nothing.
import { listFieldIdsOfGrower, listFieldIdsOfScout } from '../queries/fields.ts';
import { listFarmIdsOfGrower, listFarmIdsOfScout } from '../queries/farms.ts';
import type { Actor } from '../auth/passport.ts';

const seesWholeOrganisation = (actor: Actor) => actor.role === 'admin' || actor.role === 'adviser';

/** Field ids the actor may read, or null meaning "every field of the organisation". */
export async function visibleFieldIds(actor: Actor): Promise<string[] | null> {
  if (seesWholeOrganisation(actor)) return null;
  return actor.role === 'scout' ? listFieldIdsOfScout(actor.organisationId, actor.id) : listFieldIdsOfGrower(actor.organisationId, actor.id);
}

/** Farm ids the actor may read, or null meaning "every farm of the organisation". */
export async function visibleFarmIds(actor: Actor): Promise<string[] | null> {
  if (seesWholeOrganisation(actor)) return null;
  return actor.role === 'scout' ? listFarmIdsOfScout(actor.organisationId, actor.id) : listFarmIdsOfGrower(actor.organisationId, actor.id);
}

export async function canSeeField(actor: Actor, fieldId: string) {
  const visible = await visibleFieldIds(actor);
  return visible === null || visible.includes(fieldId);
}
