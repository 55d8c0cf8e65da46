// Sightings: read with the actor's scope, edited by advisers and their makers (audited), soft-deleted and restored.
import type { Transaction } from 'sequelize';
import { sequelize } from '../db.ts';
import * as sightings from '../queries/sightings.ts';
import { markPhotoDeleted, markPhotoRestored } from '../queries/photos.ts';
import { findPestInOrganisation } from '../queries/pests.ts';
import { findFieldName } from '../queries/fields.ts';
import type { Actor } from '../auth/passport.ts';
import {
  SIGHTING_RECOVERABLE_DAYS,
  type SightingListQuery,
  type SightingListResponse,
  type SightingUpdateInput,
  type SightingView,
} from '../../shared/schemas/sightings.ts';
import type { WalkStopInput } from '../../shared/schemas/walks.ts';
import { AppError, badRequest, conflict, forbidden, notFound } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { visibleFieldIds } from './scope.ts';
import { decodePageCursor, pageOf, type CursorPart } from './page-cursor.ts';
import { writableWalk } from './ingest-access.ts';
import { fieldContains } from './ingest-fields.ts';

/** A deleted sighting's photo stays recoverable this long; the purge job removes older ones. */
export const RECOVERABLE_DAYS = SIGHTING_RECOVERABLE_DAYS;

// Spelled out key by key, in the answer's order (the row's columns, then position): rest/spread copies of
// thousands of rows cost more than the query that read them.
/** A sighting's page key: walk day, time seen (infinity when none), upload time, id. */
const SIGHTING_KEY_PARTS: CursorPart[] = ['date', 'timestamp', 'timestamp', 'uuid'];

function present(row: sightings.SightingRow): SightingView {
  return {
    id: row.id,
    fieldId: row.fieldId,
    walkId: row.walkId,
    walkedOn: row.walkedOn,
    pestId: row.pestId,
    pestName: row.pestName,
    count: row.count,
    positionSource: row.positionSource,
    accuracyM: row.accuracyM,
    altitudeM: row.altitudeM,
    directionDeg: row.directionDeg,
    observedAt: row.observedAt,
    timeFlag: row.timeFlag,
    status: row.status,
    photoId: row.photoId,
    thumbnailStatus: row.thumbnailStatus,
    scoutId: row.scoutId,
    scoutName: row.scoutName,
    isEmptyStop: row.isEmptyStop,
    createdAt: row.createdAt,
    position: row.lon === null || row.lat === null ? null : { lon: row.lon, lat: row.lat },
  };
}

/** One page of the sightings the actor may see that match the query, in the lists' order (walk day, time seen, upload). */
export async function listSightings(actor: Actor, query: SightingListQuery): Promise<SightingListResponse> {
  const { limit, cursor, ...filter } = query;
  if ((actor.role === 'adviser' || actor.role === 'admin') && !filter.fieldId && !filter.walkId) {
    throw badRequest('Choose a field (or a walk) to list its sightings.', { fieldId: 'Choose a field.' });
  }
  const after = cursor ? decodePageCursor(cursor, SIGHTING_KEY_PARTS) : undefined;
  const ids = await visibleFieldIds(actor);
  const rows = await sightings.listSightingsOfOrganisation(actor.organisationId, ids, filter, { after, limit: limit + 1 });
  const { page, nextCursor } = pageOf(rows, limit, (row) => sightings.sightingPageKeyParts(row.pageKey));
  return { sightings: page.map(present), limit, nextCursor };
}

/** Every live sighting of a walk the caller has already been allowed to see, in the lists' order. */
export async function listSightingsOfWalk(actor: Actor, walkId: string): Promise<SightingView[]> {
  const rows = await sightings.listSightingsOfOrganisation(actor.organisationId, await visibleFieldIds(actor), { walkId });
  return rows.map(present);
}

/**
 * A walk's removed sightings the actor could restore: every one for the desk roles, a scout's own, none for a
 * grower. The caller has already checked the actor may see the walk.
 */
export async function listRestorableSightingsOfWalk(actor: Actor, walkId: string): Promise<SightingView[]> {
  if (actor.role === 'grower') return [];
  const since = new Date(Date.now() - RECOVERABLE_DAYS * 86_400_000);
  const rows = await sightings.listDeletedSightingsOfWalk(actor.organisationId, walkId, since);
  return rows.filter((row) => actor.role !== 'scout' || row.scoutId === actor.id).map(present);
}

async function findVisibleRow(actor: Actor, id: string, options: { deleted?: boolean; transaction?: Transaction } = {}) {
  const ids = await visibleFieldIds(actor);
  const row = await sightings.findSightingInOrganisation(actor.organisationId, id, options);
  if (!row || (ids && !ids.includes(row.fieldId))) throw notFound('That sighting');
  return row;
}

export async function getSighting(actor: Actor, id: string) {
  return present(await findVisibleRow(actor, id));
}

function assertMayEdit(actor: Actor, row: sightings.SightingRow) {
  if (actor.role === 'admin' || actor.role === 'adviser') return;
  if (actor.role === 'scout' && row.scoutId === actor.id) return;
  throw forbidden('Only an adviser or the scout who recorded this sighting can change it.');
}

async function assertPestInLibrary(actor: Actor, pestId: string) {
  const pest = await findPestInOrganisation(actor.organisationId, pestId);
  if (!pest) throw badRequest('Choose a pest from your organisation’s pest library.', { pestId: 'That pest is not in the library.' });
}

async function fieldName(fieldId: string) {
  return (await findFieldName(fieldId)) ?? 'the field';
}

const auditShape = (v: SightingView) => ({ pestId: v.pestId, count: v.count, position: v.position, positionSource: v.positionSource, status: v.status });

export async function updateSighting(actor: Actor, id: string, input: SightingUpdateInput) {
  const row = await findVisibleRow(actor, id);
  assertMayEdit(actor, row);
  if (input.pestId) await assertPestInLibrary(actor, input.pestId);
  if (input.position && !(await fieldContains(row.fieldId, input.position))) {
    const message = `That position lies outside ${await fieldName(row.fieldId)}; tap a point inside the field boundary.`;
    throw badRequest(message, { position: message });
  }
  const before = present(row);
  await sequelize.transaction(async (transaction) => {
    await sightings.correctSighting(id, input, { transaction });
    const after = present(await findVisibleRow(actor, id, { transaction }));
    await recordAudit(actor, 'update', 'sighting', id, { before: auditShape(before), after: auditShape(after) }, transaction);
  });
  return getSighting(actor, id);
}

export async function deleteSighting(actor: Actor, id: string) {
  const row = await findVisibleRow(actor, id);
  assertMayEdit(actor, row);
  await sequelize.transaction(async (transaction) => {
    await sightings.markSightingDeleted(id, { transaction });
    if (row.photoId) await markPhotoDeleted(row.photoId, { transaction });
    await recordAudit(actor, 'delete', 'sighting', id, { before: auditShape(present(row)), photoId: row.photoId }, transaction);
  });
}

export async function restoreSighting(actor: Actor, id: string) {
  const row = await findVisibleRow(actor, id, { deleted: true });
  assertMayEdit(actor, row);
  if (row.deletedAt && Date.now() - new Date(row.deletedAt).getTime() > RECOVERABLE_DAYS * 86_400_000) {
    throw new AppError(410, 'gone', `This sighting was deleted more than ${RECOVERABLE_DAYS} days ago and can no longer be restored.`);
  }
  try {
    await sequelize.transaction(async (transaction) => {
      await sightings.markSightingRestored(id, { transaction });
      if (row.photoId) await markPhotoRestored(row.photoId, { transaction });
      await recordAudit(actor, 'restore', 'sighting', id, {}, transaction);
    });
  } catch (error) {
    if ((error as { parent?: { code?: string } }).parent?.code === '23505') {
      throw conflict('The same photo was sent again after this sighting was deleted; the newer sighting stays and this one cannot come back.');
    }
    throw error;
  }
  return getSighting(actor, id);
}

/** An empty stop: the scout looked here for the pest and found none (position from the phone). */
export async function recordEmptyStop(actor: Actor, walkId: string, input: WalkStopInput) {
  const walk = await writableWalk(actor, walkId);
  await assertPestInLibrary(actor, input.pestId);
  const position = { lon: input.lon, lat: input.lat };
  if (!(await fieldContains(walk.fieldId, position))) {
    const message = `Your position lies outside ${walk.fieldName}; walk into the field before recording a stop.`;
    throw badRequest(message, { position: message });
  }
  const inserted = await sequelize.transaction(async (transaction) => {
    const id = await sightings.insertEmptyStop(
      {
        organisationId: actor.organisationId,
        fieldId: walk.fieldId,
        walkId,
        pestId: input.pestId,
        ...position,
        accuracyM: input.accuracyM,
        observedAt: input.observedAt ?? null,
        clientId: input.clientId ?? null,
        userId: actor.id,
      },
      { transaction },
    );
    if (id)
      await recordAudit(actor, 'create', 'sighting', id, { emptyStop: true, walkId, pestId: input.pestId, position, accuracyM: input.accuracyM }, transaction);
    return id;
  });
  if (inserted) return { sighting: await getSighting(actor, inserted), created: true };
  return { sighting: await alreadyRecordedStop(actor, input.clientId!), created: false };
}

/** The stop a retry of the same client id points at; one the scout has since removed stays removed. */
async function alreadyRecordedStop(actor: Actor, clientId: string) {
  const existing = await sightings.findSightingByClientId(actor.id, clientId);
  if (!existing) throw conflict('This stop could not be recorded; record it again.');
  try {
    return await getSighting(actor, existing.id);
  } catch (error) {
    if (error instanceof AppError && error.status === 404)
      throw conflict('This stop was sent before and has since been removed; restore it from the walk if it was right.');
    throw error;
  }
}
