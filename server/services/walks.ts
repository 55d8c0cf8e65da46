// Walks: one scouting visit to one field on one day by one scout, with its sightings and empty stops.
import type { Transaction } from 'sequelize';
import { sequelize } from '../db.ts';
import type { Actor } from '../auth/passport.ts';
import type { WalkCreateInput, WalkListQuery, WalkListResponse, WalkUpdateInput, WalkView } from '../../shared/schemas/walks.ts';
import { badRequest, conflict, notFound } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { visibleFieldIds } from './scope.ts';
import { decodePageCursor, pageOf, type CursorPart } from './page-cursor.ts';
import { writableField, writableWalk } from './ingest-access.ts';
import { listRestorableSightingsOfWalk, listSightingsOfWalk } from './sightings.ts';
import * as walks from '../queries/walks.ts';

/** A walk's page key: day, creation time, id. */
const WALK_KEY_PARTS: CursorPart[] = ['date', 'timestamp', 'uuid'];

/** One page of the walks the actor may see (of one field, one day or a window of days when asked), newest first. */
export async function listWalks(actor: Actor, query: WalkListQuery): Promise<WalkListResponse> {
  const after = query.cursor ? decodePageCursor(query.cursor, WALK_KEY_PARTS) : undefined;
  const ids = await visibleFieldIds(actor);
  const days = query.walkedOn ? { from: query.walkedOn, to: query.walkedOn } : { from: query.from, to: query.to };
  const rows = await walks.listWalksOfOrganisation(actor.organisationId, ids, { fieldId: query.fieldId, ...days, after, limit: query.limit + 1 });
  const { page, nextCursor } = pageOf(rows, query.limit, (walk) => walk.pageKey);
  return { walks: page.map(({ pageKey: _key, ...walk }) => walk), limit: query.limit, nextCursor };
}

export async function findVisibleWalk(actor: Actor, id: string, transaction?: Transaction): Promise<WalkView> {
  const ids = await visibleFieldIds(actor);
  const walk = await walks.findWalkInOrganisation(actor.organisationId, id, { transaction });
  if (!walk || (ids && !ids.includes(walk.fieldId))) throw notFound('That walk');
  return walk;
}

export async function getWalk(actor: Actor, id: string) {
  const walk = await findVisibleWalk(actor, id);
  const [sightings, removed] = await Promise.all([listSightingsOfWalk(actor, id), listRestorableSightingsOfWalk(actor, id)]);
  return { walk, sightings, removed };
}

/**
 * The walk for (field, scout, day), made if it does not exist yet. Safe under concurrent uploads: the unique
 * index decides and the loser reads the winner's row.
 */
export async function findOrCreateWalk(actor: Actor, fieldId: string, walkedOn: string, transaction?: Transaction, phoneId?: string) {
  const inserted = await walks.insertWalkIfNew({ id: phoneId, organisationId: actor.organisationId, fieldId, scoutId: actor.id, walkedOn }, { transaction });
  if (inserted) {
    await recordAudit(actor, 'create', 'walk', inserted, { fieldId, walkedOn }, transaction);
    return { id: inserted, created: true };
  }
  const existing = await walks.findWalkIdOf(fieldId, actor.id, walkedOn, { transaction });
  // Only a phone's id can make the insert give way without a walk on that field and day: the id belongs to another walk.
  if (!existing) throw conflict('That walk id from the phone is already used by another walk; start the walk again.');
  return { id: existing, created: false };
}

/** Starts a walk; starting the same field and day again returns the walk already there. */
export async function createWalk(actor: Actor, input: WalkCreateInput) {
  await writableField(actor, input.fieldId);
  const { id, created } = await sequelize.transaction(async (transaction) => {
    const found = await findOrCreateWalk(actor, input.fieldId, input.walkedOn, transaction, input.id);
    if (input.notes !== undefined && found.created) {
      await walks.setWalkNotes(found.id, input.notes, { transaction });
    }
    return found;
  });
  return { walk: await findVisibleWalk(actor, id), created };
}

export async function updateWalk(actor: Actor, id: string, input: WalkUpdateInput) {
  const before = await findVisibleWalk(actor, id);
  await writableWalk(actor, id);
  await sequelize.transaction(async (transaction) => {
    try {
      await walks.updateWalk(id, input.notes ?? null, input.walkedOn ?? null, { transaction });
    } catch (error) {
      if ((error as { parent?: { code?: string } }).parent?.code === '23505') {
        throw badRequest('You already have a walk on this field on that date; add the sightings to that walk instead.', {
          walkedOn: 'Another walk of yours on this field has that date.',
        });
      }
      throw error;
    }
    await recordAudit(actor, 'update', 'walk', id, { before: { notes: before.notes, walkedOn: before.walkedOn }, after: input }, transaction);
  });
  return findVisibleWalk(actor, id);
}

/**
 * Marks the walk finished for its scout or a desk user; finishing again keeps the first time. Nothing is closed by it:
 * photos and stops still waiting on a phone for this walk are taken as usual when they arrive late.
 */
export async function finishWalk(actor: Actor, id: string) {
  await writableWalk(actor, id);
  await sequelize.transaction(async (transaction) => {
    if (await walks.markWalkFinished(id, { transaction })) await recordAudit(actor, 'finish', 'walk', id, {}, transaction);
  });
  return findVisibleWalk(actor, id);
}
