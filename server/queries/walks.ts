import type { WalkView } from '../../shared/schemas/walks.ts';
import { execute, selectRow, selectRows, type InTransaction } from './sql.ts';
import { liveSighting } from './sightings.ts';

// Counts per walk from a lateral read of its own sightings, so a page of walks is chosen (and limited) before any counting.
const walkSelect = `
  SELECT w.id, w.field_id AS "fieldId", f.name AS "fieldName", w.scout_id AS "scoutId", u.name AS "scoutName",
         to_char(w.walked_on, 'YYYY-MM-DD') AS "walkedOn", w.notes, c."sightingCount", c."stopCount", w.created_at AS "createdAt",
         w.finished_at AS "finishedAt", ARRAY[to_char(w.walked_on, 'YYYY-MM-DD'), w.created_at::text, w.id::text] AS "pageKey"
    FROM walks w
    JOIN fields f ON f.id = w.field_id
    JOIN users u ON u.id = w.scout_id
    CROSS JOIN LATERAL (
      SELECT count(*) FILTER (WHERE NOT (s.photo_id IS NULL AND s.count = 0))::int AS "sightingCount",
             count(*) FILTER (WHERE s.photo_id IS NULL AND s.count = 0)::int AS "stopCount"
        FROM sightings s WHERE s.walk_id = w.id AND s.deleted_at IS NULL) c`;

/** A walk with its sort key (day, creation time, id), the lists' page key. */
export type KeyedWalk = WalkView & { pageKey: string[] };

async function queryWalks(where: string, replacements: Record<string, unknown>, options: InTransaction & { limit?: number } = {}): Promise<KeyedWalk[]> {
  const rows = await selectRows<KeyedWalk & { createdAt: Date; finishedAt: Date | null }>(
    `${walkSelect} WHERE ${where} ORDER BY w.walked_on DESC, w.created_at DESC, w.id DESC${options.limit ? ' LIMIT :limit' : ''}`,
    { ...replacements, limit: options.limit },
    options,
  );
  return rows.map((r) => ({ ...r, createdAt: new Date(r.createdAt).toISOString(), finishedAt: r.finishedAt && new Date(r.finishedAt).toISOString() }));
}

/**
 * One page of the organisation's walks, newest first: only on the fields in `ids` when given, only on one field when
 * `fieldId` is, walked from `from` to `to` (YYYY-MM-DD, both included, either open) when given, strictly after the
 * sort key `after` (day, creation time, id) when given.
 */
export function listWalksOfOrganisation(
  organisationId: string,
  ids: string[] | null,
  page: { fieldId?: string; from?: string; to?: string; after?: string[]; limit: number },
) {
  const conditions = ['w.organisation_id = :org'];
  if (ids) conditions.push(ids.length ? 'w.field_id IN (:ids)' : 'false');
  if (page.fieldId) conditions.push('w.field_id = :fieldId');
  if (page.from) conditions.push('w.walked_on >= CAST(:from AS date)');
  if (page.to) conditions.push('w.walked_on <= CAST(:to AS date)');
  if (page.after) conditions.push('(w.walked_on, w.created_at, w.id) < (CAST(:afterDay AS date), CAST(:afterCreated AS timestamptz), CAST(:afterId AS uuid))');
  const [afterDay, afterCreated, afterId] = page.after ?? [];
  return queryWalks(
    conditions.join(' AND '),
    { org: organisationId, ids, fieldId: page.fieldId, from: page.from, to: page.to, afterDay, afterCreated, afterId },
    { limit: page.limit },
  );
}

export async function findWalkInOrganisation(organisationId: string, id: string, options: InTransaction = {}): Promise<WalkView | undefined> {
  const [found] = await queryWalks('w.id = :id AND w.organisation_id = :org', { id, org: organisationId }, options);
  if (!found) return undefined;
  const { pageKey: _key, ...walk } = found;
  return walk;
}

export interface WalkRef {
  id: string;
  fieldId: string;
  fieldName: string;
  scoutId: string;
  walkedOn: string;
}

export const findWalkRef = (organisationId: string, walkId: string, options: InTransaction = {}) =>
  selectRow<WalkRef>(
    `SELECT w.id, w.field_id AS "fieldId", f.name AS "fieldName", w.scout_id AS "scoutId", to_char(w.walked_on, 'YYYY-MM-DD') AS "walkedOn"
       FROM walks w JOIN fields f ON f.id = w.field_id WHERE w.id = :walkId AND w.organisation_id = :org`,
    { walkId, org: organisationId },
    options,
  );

/** Inserts the walk unless (field, scout, day) has one; the new id, or undefined when it was there already. */
/**
 * Inserts the walk unless the scout has one on that field and day, or (with a phone's id) the id is taken;
 * undefined when nothing was inserted.
 */
export const insertWalkIfNew = async (
  walk: { id?: string; organisationId: string; fieldId: string; scoutId: string; walkedOn: string },
  options: InTransaction = {},
) =>
  (
    await selectRow<{ id: string }>(
      `INSERT INTO walks (id, organisation_id, field_id, scout_id, walked_on)
       VALUES (COALESCE(CAST(:id AS uuid), gen_random_uuid()), :org, :fieldId, :scoutId, :walkedOn)
       ON CONFLICT DO NOTHING RETURNING id`,
      { id: walk.id ?? null, org: walk.organisationId, fieldId: walk.fieldId, scoutId: walk.scoutId, walkedOn: walk.walkedOn },
      options,
    )
  )?.id;

export const findWalkIdOf = async (fieldId: string, scoutId: string, walkedOn: string, options: InTransaction = {}) =>
  (
    await selectRow<{ id: string }>(
      'SELECT id FROM walks WHERE field_id = :fieldId AND scout_id = :scoutId AND walked_on = :walkedOn',
      { fieldId, scoutId, walkedOn },
      options,
    )
  )?.id;

export const setWalkNotes = (id: string, notes: string, options: InTransaction = {}) =>
  execute('UPDATE walks SET notes = :notes WHERE id = :id', { notes, id }, options);

/** Changes the notes and the day given (null keeps each as it is). */
export const updateWalk = (id: string, notes: string | null, walkedOn: string | null, options: InTransaction = {}) =>
  execute(
    `UPDATE walks SET notes = COALESCE(:notes, notes), walked_on = COALESCE(CAST(:walkedOn AS date), walked_on), updated_at = now() WHERE id = :id`,
    { id, notes, walkedOn },
    options,
  );

/** Marks the walk finished now unless it was already: the first finish stands. True when this call marked it. */
export const markWalkFinished = async (id: string, options: InTransaction = {}) =>
  !!(await selectRow<{ id: string }>(
    'UPDATE walks SET finished_at = now(), updated_at = now() WHERE id = :id AND finished_at IS NULL RETURNING id',
    { id },
    options,
  ));

export interface WalkPestRow {
  walkId: string;
  walkedOn: string;
  scoutId: string;
  scoutName: string;
  pestId: string | null;
  pestName: string | null;
  sightings: number;
  stops: number;
  meanCount: number | null;
}

/** A field's walks, each with its live sightings per pest (one pest only when given); a walk without any still has a row. */
export const listWalksOfFieldByPest = (fieldId: string, pestId: string | null) =>
  selectRows<WalkPestRow>(
    `SELECT w.id AS "walkId", to_char(w.walked_on, 'YYYY-MM-DD') AS "walkedOn", u.id AS "scoutId", u.name AS "scoutName",
            p.id AS "pestId", p.name AS "pestName",
            count(s.id) FILTER (WHERE s.count IS NULL OR s.count > 0) AS sightings,
            count(s.id) AS stops,
            avg(s.count) AS "meanCount"
       FROM walks w
       JOIN users u ON u.id = w.scout_id
       LEFT JOIN sightings s ON s.walk_id = w.id AND ${liveSighting('s')}
                             AND (CAST(:pestId AS uuid) IS NULL OR s.pest_id = CAST(:pestId AS uuid))
       LEFT JOIN pests p ON p.id = s.pest_id
      WHERE w.field_id = :fieldId
      GROUP BY w.id, w.walked_on, u.id, p.id
      ORDER BY w.walked_on, w.id, p.name`,
    { fieldId, pestId },
  );
