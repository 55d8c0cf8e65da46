// Who may add to which field and walk. Reading goes through scope.ts; writing is narrower:
// scouts write only on fields assigned to them and only to their own walks; growers never write.
import type { Transaction } from 'sequelize';
import { findFieldRefInOrganisation } from '../queries/fields.ts';
import { findWalkRef, type WalkRef } from '../queries/walks.ts';
import type { Actor } from '../auth/passport.ts';
import { forbidden, notFound } from '../errors.ts';
import { canSeeField } from './scope.ts';

export interface FieldRef {
  id: string;
  name: string;
}

export function assertMayRecord(actor: Actor) {
  if (actor.role === 'grower') throw forbidden('Growers can view sightings but not add them; ask your adviser or scout.');
}

/** The field, if the actor may record sightings on it; otherwise a 404 (not visible) or 403 (not assigned). */
export async function writableField(actor: Actor, fieldId: string, transaction?: Transaction): Promise<FieldRef> {
  assertMayRecord(actor);
  const field = await findFieldRefInOrganisation(actor.organisationId, fieldId, { transaction });
  if (!field) throw notFound('That field');
  if (!(await canSeeField(actor, fieldId)))
    throw forbidden('You are not assigned to that field; ask an adviser to assign you before recording sightings there.');
  return field;
}

export type { WalkRef };

/** The walk, if the actor may add sightings to it. */
export async function writableWalk(actor: Actor, walkId: string, transaction?: Transaction): Promise<WalkRef> {
  assertMayRecord(actor);
  const walk = await findWalkRef(actor.organisationId, walkId, { transaction });
  if (!walk || !(await canSeeField(actor, walk.fieldId))) throw notFound('That walk');
  if (actor.role === 'scout' && walk.scoutId !== actor.id) throw forbidden('That walk belongs to another scout; start your own walk for this field.');
  return walk;
}
