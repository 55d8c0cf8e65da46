// Walks: one scouting visit to one field on one day by one scout, with its sightings and empty stops.
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../db.ts';
import type { Actor } from '../auth/passport.ts';
import type { WalkCreateInput, WalkUpdateInput, WalkView } from '../../shared/schemas/walks.ts';
import { badRequest, notFound } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { visibleFieldIds } from './scope.ts';
import { writableField, writableWalk } from './ingest-access.ts';
import { listSightings } from './sightings.ts';

const walkSelect = `
  SELECT w.id, w.field_id AS "fieldId", f.name AS "fieldName", w.scout_id AS "scoutId", u.name AS "scoutName",
         to_char(w.walked_on, 'YYYY-MM-DD') AS "walkedOn", w.notes,
         count(s.id) FILTER (WHERE NOT (s.photo_id IS NULL AND s.count = 0))::int AS "sightingCount",
         count(s.id) FILTER (WHERE s.photo_id IS NULL AND s.count = 0)::int AS "stopCount",
         w.created_at AS "createdAt"
    FROM walks w
    JOIN fields f ON f.id = w.field_id
    JOIN users u ON u.id = w.scout_id
    LEFT JOIN sightings s ON s.walk_id = w.id AND s.deleted_at IS NULL`;

async function queryWalks(where: string, replacements: Record<string, unknown>, transaction?: Transaction): Promise<WalkView[]> {
  const rows = await sequelize.query<WalkView & { createdAt: Date }>(
    `${walkSelect} WHERE ${where} GROUP BY w.id, f.name, u.name ORDER BY w.walked_on DESC, w.created_at DESC`,
    {
      replacements,
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return rows.map((r) => ({ ...r, createdAt: new Date(r.createdAt).toISOString() }));
}

export async function listWalks(actor: Actor, filter: { fieldId?: string } = {}) {
  const ids = await visibleFieldIds(actor);
  const conditions = ['w.organisation_id = :org'];
  if (ids) conditions.push(ids.length ? 'w.field_id IN (:ids)' : 'false');
  if (filter.fieldId) conditions.push('w.field_id = :fieldId');
  return queryWalks(conditions.join(' AND '), { org: actor.organisationId, ids, fieldId: filter.fieldId });
}

export async function findVisibleWalk(actor: Actor, id: string, transaction?: Transaction): Promise<WalkView> {
  const ids = await visibleFieldIds(actor);
  const [walk] = await queryWalks('w.id = :id AND w.organisation_id = :org', { id, org: actor.organisationId }, transaction);
  if (!walk || (ids && !ids.includes(walk.fieldId))) throw notFound('That walk');
  return walk;
}

export async function getWalk(actor: Actor, id: string) {
  const walk = await findVisibleWalk(actor, id);
  return { walk, sightings: await listSightings(actor, { walkId: id }) };
}

/**
 * The walk for (field, scout, day), made if it does not exist yet. Safe under concurrent uploads: the unique
 * index decides and the loser reads the winner's row.
 */
export async function findOrCreateWalk(actor: Actor, fieldId: string, walkedOn: string, transaction?: Transaction) {
  const inserted = await sequelize.query<{ id: string }>(
    `INSERT INTO walks (organisation_id, field_id, scout_id, walked_on) VALUES (:org, :fieldId, :scoutId, :walkedOn)
     ON CONFLICT (field_id, scout_id, walked_on) DO NOTHING RETURNING id`,
    { replacements: { org: actor.organisationId, fieldId, scoutId: actor.id, walkedOn }, type: QueryTypes.SELECT, transaction },
  );
  if (inserted[0]) {
    await recordAudit(actor, 'create', 'walk', inserted[0].id, { fieldId, walkedOn }, transaction);
    return { id: inserted[0].id, created: true };
  }
  const [existing] = await sequelize.query<{ id: string }>('SELECT id FROM walks WHERE field_id = :fieldId AND scout_id = :scoutId AND walked_on = :walkedOn', {
    replacements: { fieldId, scoutId: actor.id, walkedOn },
    type: QueryTypes.SELECT,
    transaction,
  });
  return { id: existing.id, created: false };
}

/** Starts a walk; starting the same field and day again returns the walk already there. */
export async function createWalk(actor: Actor, input: WalkCreateInput) {
  await writableField(actor, input.fieldId);
  const { id, created } = await sequelize.transaction(async (transaction) => {
    const found = await findOrCreateWalk(actor, input.fieldId, input.walkedOn, transaction);
    if (input.notes !== undefined && found.created) {
      await sequelize.query('UPDATE walks SET notes = :notes WHERE id = :id', { replacements: { notes: input.notes, id: found.id }, transaction });
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
      await sequelize.query(
        `UPDATE walks SET notes = COALESCE(:notes, notes), walked_on = COALESCE(CAST(:walkedOn AS date), walked_on), updated_at = now() WHERE id = :id`,
        { replacements: { id, notes: input.notes ?? null, walkedOn: input.walkedOn ?? null }, transaction },
      );
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
