// Sightings: read with the actor's scope, edited by advisers and their makers (audited), soft-deleted and restored.
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../db.ts';
import type { Actor } from '../auth/passport.ts';
import type { SightingListQuery, SightingUpdateInput, SightingView } from '../../shared/schemas/sightings.ts';
import type { WalkStopInput } from '../../shared/schemas/walks.ts';
import { AppError, badRequest, conflict, forbidden, notFound } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { visibleFieldIds } from './scope.ts';
import { writableWalk } from './ingest-access.ts';
import { fieldContains } from './ingest-fields.ts';

/** A deleted sighting's photo stays recoverable this long; the purge job removes older ones. */
export const RECOVERABLE_DAYS = 30;

const sightingSelect = `
  SELECT s.id, s.field_id AS "fieldId", s.walk_id AS "walkId", to_char(w.walked_on, 'YYYY-MM-DD') AS "walkedOn",
         s.pest_id AS "pestId", p.name AS "pestName", s.count,
         ST_X(s.position) AS lon, ST_Y(s.position) AS lat,
         s.position_source AS "positionSource", s.accuracy_m AS "accuracyM", s.altitude_m AS "altitudeM",
         s.direction_deg AS "directionDeg", s.observed_at AS "observedAt", s.time_flag AS "timeFlag", s.status,
         s.photo_id AS "photoId", ph.thumbnail_status AS "thumbnailStatus", s.created_by AS "scoutId", u.name AS "scoutName",
         (s.photo_id IS NULL AND s.count = 0) AS "isEmptyStop", s.created_at AS "createdAt", s.deleted_at AS "deletedAt"
    FROM sightings s
    JOIN walks w ON w.id = s.walk_id
    JOIN pests p ON p.id = s.pest_id
    JOIN users u ON u.id = s.created_by
    LEFT JOIN photos ph ON ph.id = s.photo_id`;

type SightingRow = Omit<SightingView, 'position' | 'observedAt' | 'createdAt'> & {
  lon: number | null;
  lat: number | null;
  observedAt: Date | null;
  createdAt: Date;
  deletedAt: Date | null;
};

// Spelled out key by key, in the answer's order (the row's columns, then position): rest/spread copies of
// thousands of rows cost more than the query that read them.
function present(row: SightingRow): SightingView {
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
    observedAt: row.observedAt ? new Date(row.observedAt).toISOString() : null,
    timeFlag: row.timeFlag,
    status: row.status,
    photoId: row.photoId,
    thumbnailStatus: row.thumbnailStatus,
    scoutId: row.scoutId,
    scoutName: row.scoutName,
    isEmptyStop: row.isEmptyStop,
    createdAt: new Date(row.createdAt).toISOString(),
    position: row.lon === null || row.lat === null ? null : { lon: row.lon, lat: row.lat },
  };
}

async function querySightings(where: string[], replacements: Record<string, unknown>, transaction?: Transaction) {
  const rows = await sequelize.query<SightingRow>(
    `${sightingSelect} WHERE ${where.join(' AND ')} ORDER BY w.walked_on, s.observed_at NULLS LAST, s.created_at`,
    {
      replacements,
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return rows;
}

export async function listSightings(actor: Actor, query: SightingListQuery): Promise<SightingView[]> {
  if ((actor.role === 'adviser' || actor.role === 'admin') && !query.fieldId && !query.walkId) {
    throw badRequest('Choose a field (or a walk) to list its sightings.', { fieldId: 'Choose a field.' });
  }
  const ids = await visibleFieldIds(actor);
  const where = ['s.organisation_id = :org', 's.deleted_at IS NULL'];
  if (ids) where.push(ids.length ? 's.field_id IN (:ids)' : 'false');
  if (query.fieldId) where.push('s.field_id = :fieldId');
  if (query.walkId) where.push('s.walk_id = :walkId');
  if (query.pestId) where.push('s.pest_id = :pestId');
  if (query.scoutId) where.push('s.created_by = :scoutId');
  if (query.from) where.push('w.walked_on >= CAST(:from AS date)');
  if (query.to) where.push('w.walked_on <= CAST(:to AS date)');
  if (query.status) where.push('s.status = :status');
  const rows = await querySightings(where, { org: actor.organisationId, ids, ...query });
  return rows.map(present);
}

async function findVisibleRow(actor: Actor, id: string, options: { deleted?: boolean; transaction?: Transaction } = {}) {
  const ids = await visibleFieldIds(actor);
  const [row] = await querySightings(
    ['s.id = :id', 's.organisation_id = :org', options.deleted ? 's.deleted_at IS NOT NULL' : 's.deleted_at IS NULL'],
    { id, org: actor.organisationId },
    options.transaction,
  );
  if (!row || (ids && !ids.includes(row.fieldId))) throw notFound('That sighting');
  return row;
}

export async function getSighting(actor: Actor, id: string) {
  return present(await findVisibleRow(actor, id));
}

function assertMayEdit(actor: Actor, row: SightingRow) {
  if (actor.role === 'admin' || actor.role === 'adviser') return;
  if (actor.role === 'scout' && row.scoutId === actor.id) return;
  throw forbidden('Only an adviser or the scout who recorded this sighting can change it.');
}

async function assertPestInLibrary(actor: Actor, pestId: string) {
  const [pest] = await sequelize.query<{ id: string }>('SELECT id FROM pests WHERE id = :pestId AND organisation_id = :org', {
    replacements: { pestId, org: actor.organisationId },
    type: QueryTypes.SELECT,
  });
  if (!pest) throw badRequest('Choose a pest from your organisation’s pest library.', { pestId: 'That pest is not in the library.' });
}

async function fieldName(fieldId: string) {
  const [row] = await sequelize.query<{ name: string }>('SELECT name FROM fields WHERE id = :fieldId', { replacements: { fieldId }, type: QueryTypes.SELECT });
  return row?.name ?? 'the field';
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
    await sequelize.query(
      `UPDATE sightings SET
         pest_id = COALESCE(:pestId, pest_id),
         count = CASE WHEN :setCount THEN CAST(:count AS double precision) ELSE count END,
         position = CASE WHEN :setPosition THEN ST_SetSRID(ST_MakePoint(:lon, :lat), 4326) ELSE position END,
         position_source = CASE WHEN :setPosition THEN 'pin' ELSE position_source END,
         accuracy_m = CASE WHEN :setPosition THEN NULL ELSE accuracy_m END,
         status = CASE WHEN :setPosition THEN 'placed' ELSE status END,
         updated_at = now()
       WHERE id = :id`,
      {
        replacements: {
          id,
          pestId: input.pestId ?? null,
          setCount: input.count !== undefined,
          count: input.count ?? null,
          setPosition: input.position !== undefined,
          lon: input.position?.lon ?? 0,
          lat: input.position?.lat ?? 0,
        },
        transaction,
      },
    );
    const after = present(await findVisibleRow(actor, id, { transaction }));
    await recordAudit(actor, 'update', 'sighting', id, { before: auditShape(before), after: auditShape(after) }, transaction);
  });
  return getSighting(actor, id);
}

export async function deleteSighting(actor: Actor, id: string) {
  const row = await findVisibleRow(actor, id);
  assertMayEdit(actor, row);
  await sequelize.transaction(async (transaction) => {
    await sequelize.query('UPDATE sightings SET deleted_at = now(), updated_at = now() WHERE id = :id', { replacements: { id }, transaction });
    if (row.photoId)
      await sequelize.query('UPDATE photos SET deleted_at = now(), updated_at = now() WHERE id = :photoId', {
        replacements: { photoId: row.photoId },
        transaction,
      });
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
      await sequelize.query('UPDATE sightings SET deleted_at = NULL, updated_at = now() WHERE id = :id', { replacements: { id }, transaction });
      if (row.photoId)
        await sequelize.query('UPDATE photos SET deleted_at = NULL, updated_at = now() WHERE id = :photoId', {
          replacements: { photoId: row.photoId },
          transaction,
        });
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
  const id = await sequelize.transaction(async (transaction) => {
    const [row] = await sequelize.query<{ id: string }>(
      `INSERT INTO sightings (organisation_id, field_id, walk_id, pest_id, count, position, position_source, accuracy_m, observed_at, status, created_by)
       VALUES (:org, :fieldId, :walkId, :pestId, 0, ST_SetSRID(ST_MakePoint(:lon, :lat), 4326), 'device', :accuracyM, now(), 'placed', :userId)
       RETURNING id`,
      {
        replacements: {
          org: actor.organisationId,
          fieldId: walk.fieldId,
          walkId,
          pestId: input.pestId,
          ...position,
          accuracyM: input.accuracyM,
          userId: actor.id,
        },
        type: QueryTypes.SELECT,
        transaction,
      },
    );
    await recordAudit(
      actor,
      'create',
      'sighting',
      row.id,
      { emptyStop: true, walkId, pestId: input.pestId, position, accuracyM: input.accuracyM },
      transaction,
    );
    return row.id;
  });
  return getSighting(actor, id);
}
