import type { Transaction } from 'sequelize';
import type { SightingFilter, SightingView } from '../../shared/schemas/sightings.ts';
import type { ThresholdBasis } from '../../shared/schemas/pests.ts';
import { execute, selectRow, selectRows, type InTransaction } from './sql.ts';

// The one statement of what a live sighting is: not deleted and placed on the map (a photo still waiting for its pin
// has no position). Every query that reads sightings for checks, zones, notices or lists of found pests uses it.
export const liveSighting = (alias: string) => `${alias}.deleted_at IS NULL AND ${alias}.status = 'placed'`;

// The lists' one order: walk day, then time seen (none last), then upload, then id so ties still fall one way. As a row
// value it is the page key; PostgreSQL's own text of each part keeps the microseconds a JavaScript date would drop.
// The key comes back as one text joined by commas (no part holds one) and is split only for a page's last row:
// parsing a text[] on every row cost more than building the row.
const SIGHTING_ORDER = `w.walked_on, COALESCE(s.observed_at, CAST('infinity' AS timestamptz)), s.created_at, s.id`;
const SIGHTING_KEY = `concat_ws(',', to_char(w.walked_on, 'YYYY-MM-DD'), COALESCE(s.observed_at, CAST('infinity' AS timestamptz))::text, s.created_at::text, s.id::text)`;
/** A page key's parts from the joined text the list query returns. */
export const sightingPageKeyParts = (pageKey: string) => pageKey.split(',');

// A timestamptz as the answer spells it (an ISO 8601 instant in UTC with milliseconds, as Date#toISOString does),
// written by PostgreSQL so the rows need no date parsing and formatting in JavaScript.
const isoInstant = (column: string) => `to_char(${column} AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`;

const sightingSelect = `
  SELECT s.id, s.field_id AS "fieldId", s.walk_id AS "walkId", to_char(w.walked_on, 'YYYY-MM-DD') AS "walkedOn",
         s.pest_id AS "pestId", p.name AS "pestName", s.count,
         ST_X(s.position) AS lon, ST_Y(s.position) AS lat,
         s.position_source AS "positionSource", s.accuracy_m AS "accuracyM", s.altitude_m AS "altitudeM",
         s.direction_deg AS "directionDeg", ${isoInstant('s.observed_at')} AS "observedAt", s.time_flag AS "timeFlag", s.status,
         s.photo_id AS "photoId", ph.thumbnail_status AS "thumbnailStatus", s.created_by AS "scoutId", u.name AS "scoutName",
         (s.photo_id IS NULL AND s.count = 0) AS "isEmptyStop", ${isoInstant('s.created_at')} AS "createdAt", s.deleted_at AS "deletedAt",
         ${SIGHTING_KEY} AS "pageKey"
    FROM sightings s
    JOIN walks w ON w.id = s.walk_id
    JOIN pests p ON p.id = s.pest_id
    JOIN users u ON u.id = s.created_by
    LEFT JOIN photos ph ON ph.id = s.photo_id`;

/** `observedAt` and `createdAt` come already written as the answer gives them (ISO 8601, UTC, milliseconds). */
export type SightingRow = Omit<SightingView, 'position'> & {
  lon: number | null;
  lat: number | null;
  deletedAt: Date | null;
};

async function querySightings(where: string[], replacements: Record<string, unknown>, transaction?: Transaction, limit?: number) {
  return selectRows<SightingRow>(
    `${sightingSelect} WHERE ${where.join(' AND ')} ORDER BY ${SIGHTING_ORDER}${limit ? ' LIMIT :limit' : ''}`,
    { ...replacements, limit },
    { transaction },
  );
}

/** Strictly after this sort key (walk day, time seen or infinity, upload time, id), at most `limit` rows. */
export interface SightingPage {
  after?: string[];
  limit: number;
}

/**
 * The organisation's sightings not deleted (placed or waiting for a pin) matching the query; only on the fields in `ids`
 * when given; one page of them when `page` is given, each row with its sort key.
 */
export function listSightingsOfOrganisation(
  organisationId: string,
  ids: string[] | null,
  query: SightingFilter,
  page?: SightingPage,
): Promise<Array<SightingRow & { pageKey: string }>> {
  const where = ['s.organisation_id = :org', 's.deleted_at IS NULL'];
  if (ids) where.push(ids.length ? 's.field_id IN (:ids)' : 'false');
  if (query.fieldId) where.push('s.field_id = :fieldId');
  if (query.walkId) where.push('s.walk_id = :walkId');
  if (query.pestId) where.push('s.pest_id = :pestId');
  if (query.scoutId) where.push('s.created_by = :scoutId');
  if (query.from) where.push('w.walked_on >= CAST(:from AS date)');
  if (query.to) where.push('w.walked_on <= CAST(:to AS date)');
  if (query.status) where.push('s.status = :status');
  const after = page?.after;
  if (after)
    where.push(`(${SIGHTING_ORDER}) > (CAST(:afterDay AS date), CAST(:afterSeen AS timestamptz), CAST(:afterCreated AS timestamptz), CAST(:afterId AS uuid))`);
  return querySightings(
    where,
    { org: organisationId, ids, ...query, afterDay: after?.[0], afterSeen: after?.[1], afterCreated: after?.[2], afterId: after?.[3] },
    undefined,
    page?.limit,
  ) as Promise<Array<SightingRow & { pageKey: string }>>;
}

/** A walk's sightings deleted since the cutoff (still restorable), most recently deleted first. */
export const listDeletedSightingsOfWalk = async (organisationId: string, walkId: string, since: Date) =>
  (
    await querySightings(['s.organisation_id = :org', 's.walk_id = :walkId', 's.deleted_at IS NOT NULL', 's.deleted_at >= :since'], {
      org: organisationId,
      walkId,
      since,
    })
  ).sort((a, b) => new Date(b.deletedAt!).getTime() - new Date(a.deletedAt!).getTime());

/** One of the organisation's sightings, deleted or not as asked. */
export const findSightingInOrganisation = async (organisationId: string, id: string, options: { deleted?: boolean; transaction?: Transaction } = {}) =>
  (
    await querySightings(
      ['s.id = :id', 's.organisation_id = :org', options.deleted ? 's.deleted_at IS NOT NULL' : 's.deleted_at IS NULL'],
      { id, org: organisationId },
      options.transaction,
    )
  )[0] as SightingRow | undefined;

export interface SightingCorrection {
  pestId?: string;
  count?: number | null;
  position?: { lon: number; lat: number };
}

/** A correction: a new position is a pin, so the sighting is placed. */
export const correctSighting = (id: string, input: SightingCorrection, options: InTransaction = {}) =>
  execute(
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
      id,
      pestId: input.pestId ?? null,
      setCount: input.count !== undefined,
      count: input.count ?? null,
      setPosition: input.position !== undefined,
      lon: input.position?.lon ?? 0,
      lat: input.position?.lat ?? 0,
    },
    options,
  );

export const markSightingDeleted = (id: string, options: InTransaction = {}) =>
  execute('UPDATE sightings SET deleted_at = now(), updated_at = now() WHERE id = :id', { id }, options);

export const markSightingRestored = (id: string, options: InTransaction = {}) =>
  execute('UPDATE sightings SET deleted_at = NULL, updated_at = now() WHERE id = :id', { id }, options);

export interface NewEmptyStop {
  organisationId: string;
  fieldId: string;
  walkId: string;
  pestId: string;
  lon: number;
  lat: number;
  accuracyM: number | null | undefined;
  userId: string;
  /** When the scout stood there (a stop kept on the phone and sent later); now when absent. */
  observedAt?: string | null;
  /** The phone's own id for the stop. */
  clientId?: string | null;
}

/** An empty stop: count 0 at the phone's position, placed at once; a client id this scout already used inserts nothing (undefined). */
export const insertEmptyStop = async (stop: NewEmptyStop, options: InTransaction = {}) =>
  (
    await selectRow<{ id: string }>(
      `INSERT INTO sightings (organisation_id, field_id, walk_id, pest_id, count, position, position_source, accuracy_m, observed_at, status, created_by, client_id)
         VALUES (:org, :fieldId, :walkId, :pestId, 0, ST_SetSRID(ST_MakePoint(:lon, :lat), 4326), 'device', :accuracyM,
                 COALESCE(CAST(:observedAt AS timestamptz), now()), 'placed', :userId, :clientId)
         ON CONFLICT (created_by, client_id) WHERE client_id IS NOT NULL DO NOTHING
         RETURNING id`,
      {
        org: stop.organisationId,
        fieldId: stop.fieldId,
        walkId: stop.walkId,
        pestId: stop.pestId,
        lon: stop.lon,
        lat: stop.lat,
        accuracyM: stop.accuracyM,
        userId: stop.userId,
        observedAt: stop.observedAt ?? null,
        clientId: stop.clientId ?? null,
      },
      options,
    )
  )?.id;

/** The sighting a scout already made under this client id, deleted or not. */
export const findSightingByClientId = (userId: string, clientId: string) =>
  selectRow<{ id: string; walkId: string }>(`SELECT id, walk_id AS "walkId" FROM sightings WHERE created_by = :userId AND client_id = :clientId`, {
    userId,
    clientId,
  });

/** The field's sighting (not deleted) made from the photo with this hash. */
export const findSightingOfPhotoHash = (fieldId: string, sha256: string) =>
  selectRow<{ id: string; walkId: string; photoId: string }>(
    'SELECT id, walk_id AS "walkId", photo_id AS "photoId" FROM sightings WHERE field_id = :fieldId AND photo_sha256 = :sha256 AND deleted_at IS NULL',
    { fieldId, sha256 },
  );

export interface NewPhotoSighting {
  org: string;
  fieldId: string;
  walkId: string;
  pestId: string;
  photoId: string;
  sha256: string;
  count: number | null;
  hasPosition: boolean;
  lon: number;
  lat: number;
  positionSource: 'exif' | 'pin';
  accuracyM: number | null;
  altitudeM: number | null;
  directionDeg: number | null;
  observedAt: Date | string | null;
  timeFlag: string | null;
  status: 'placed' | 'needs-pin';
  userId: string;
}

export const insertPhotoSighting = async (sighting: NewPhotoSighting, options: InTransaction = {}) =>
  (await selectRow<{ id: string }>(
    `INSERT INTO sightings (organisation_id, field_id, walk_id, pest_id, photo_id, photo_sha256, count, position, position_source,
                                accuracy_m, altitude_m, direction_deg, observed_at, time_flag, status, created_by)
         VALUES (:org, :fieldId, :walkId, :pestId, :photoId, :sha256, :count,
                 CASE WHEN :hasPosition THEN ST_SetSRID(ST_MakePoint(:lon, :lat), 4326) END, :positionSource,
                 :accuracyM, :altitudeM, :directionDeg, :observedAt, :timeFlag, :status, :userId)
         RETURNING id`,
    { ...sighting },
    options,
  ))!.id;

/** Removes the sightings deleted before the cutoff; the photo ids they held. */
export const purgeSightingsDeletedBefore = async (cutoff: Date, options: InTransaction = {}) =>
  selectRows<{ photoId: string | null }>('DELETE FROM sightings WHERE deleted_at < :cutoff RETURNING photo_id AS "photoId"', { cutoff }, options);

export interface StoredSighting {
  id: string;
  lon: number;
  lat: number;
  count: number | null;
  walkId?: string | null;
  accuracyM?: number | null;
  /** UTC, microseconds, so an edit always changes the hash. */
  updatedAt: string;
}

export interface SightingWindow {
  fieldId: string;
  pestId: string;
  from?: string | null;
  to?: string | null;
}

const sightingColumns = `s.id, ST_X(s.position) AS lon, ST_Y(s.position) AS lat, s.count, s.walk_id AS "walkId", s.accuracy_m AS "accuracyM",
  to_char(s.updated_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"') AS "updatedAt"`;

/** The live sightings of a pest in a field whose walk falls in the window, empty stops included, by id. */
export const liveSightingsInWindow = (window: SightingWindow) =>
  selectRows<StoredSighting>(
    `SELECT ${sightingColumns}
       FROM sightings s JOIN walks w ON w.id = s.walk_id
      WHERE s.field_id = :fieldId AND s.pest_id = :pestId AND ${liveSighting('s')}
        AND (CAST(:from AS date) IS NULL OR w.walked_on >= CAST(:from AS date))
        AND (CAST(:to AS date) IS NULL OR w.walked_on <= CAST(:to AS date))
      ORDER BY s.id`,
    { fieldId: window.fieldId, pestId: window.pestId, from: window.from ?? null, to: window.to ?? null },
  );

/** A walk's live sightings and empty stops in the order they were made (the phone's time, else the server's). */
export const liveSightingsOfWalkInTimeOrder = (walkId: string) =>
  selectRows<StoredSighting>(
    `SELECT ${sightingColumns} FROM sightings s
      WHERE s.walk_id = :walkId AND ${liveSighting('s')}
      ORDER BY COALESCE(s.observed_at, s.created_at), s.created_at, s.id`,
    { walkId },
  );

/** The live ones of these sightings, by id. */
export const liveSightingsByIds = (ids: string[]) =>
  ids.length === 0
    ? Promise.resolve([] as StoredSighting[])
    : selectRows<StoredSighting>(
        `SELECT ${sightingColumns} FROM sightings s
      WHERE s.id = ANY(CAST(:ids AS uuid[])) AND ${liveSighting('s')} ORDER BY s.id`,
        { ids: `{${ids.join(',')}}` },
      );

export interface StopRow {
  walkId: string;
  walkedOn: string;
  pestId: string;
  pestName: string;
  countUnit: string;
  actionThreshold: number;
  thresholdBasis: ThresholdBasis;
  thresholdSource: string;
  thresholdConfirmed: boolean;
  counts: Array<number | null>;
}

/** Live stops per walk and pest for a field (empty stops are count 0), newest walk first. */
export const liveStopsByWalkAndPest = (fieldId: string, filter: { pestId?: string; walkId?: string } = {}) =>
  selectRows<StopRow>(
    `SELECT w.id AS "walkId", to_char(w.walked_on, 'YYYY-MM-DD') AS "walkedOn", p.id AS "pestId", p.name AS "pestName",
            p.count_unit AS "countUnit", p.action_threshold AS "actionThreshold", p.threshold_basis AS "thresholdBasis",
            p.threshold_source AS "thresholdSource", p.threshold_confirmed AS "thresholdConfirmed", array_agg(s.count ORDER BY s.id) AS counts
       FROM sightings s JOIN walks w ON w.id = s.walk_id JOIN pests p ON p.id = s.pest_id
      WHERE s.field_id = :fieldId AND ${liveSighting('s')}
        AND (CAST(:pestId AS uuid) IS NULL OR s.pest_id = CAST(:pestId AS uuid))
        AND (CAST(:walkId AS uuid) IS NULL OR s.walk_id = CAST(:walkId AS uuid))
      GROUP BY w.id, w.walked_on, p.id
      ORDER BY w.walked_on DESC, w.id, p.name`,
    { fieldId, pestId: filter.pestId ?? null, walkId: filter.walkId ?? null },
  );

/**
 * The sightings behind a notice: the check's own (`sightingIds`), or (hand-drawn zones, `sightingIds` null) the
 * field's sightings of the pest. Returns the filter and its replacements for the two queries below.
 */
const noticeSightings = (sightingIds: string[] | null, fieldId: string, pestId: string) => ({
  filter: sightingIds ? 's.id = ANY(CAST(:ids AS uuid[]))' : 's.field_id = :fieldId AND s.pest_id = :pestId',
  replacements: { ids: sightingIds ? `{${sightingIds.join(',')}}` : '{}', fieldId, pestId },
});

/** Positions of the live sightings with the pest found (count above 0, or no count). */
export function listFoundPositions(sightingIds: string[] | null, fieldId: string, pestId: string) {
  const { filter, replacements } = noticeSightings(sightingIds, fieldId, pestId);
  return selectRows<{ lon: number; lat: number }>(
    `SELECT ST_X(s.position) AS lon, ST_Y(s.position) AS lat FROM sightings s
      WHERE ${filter} AND ${liveSighting('s')} AND (s.count IS NULL OR s.count > 0)`,
    replacements,
  );
}

/** The walk days of the sightings not deleted (placed or not), in order. */
export async function listWalkDatesOfSightings(sightingIds: string[] | null, fieldId: string, pestId: string) {
  const { filter, replacements } = noticeSightings(sightingIds, fieldId, pestId);
  return (
    await selectRows<{ walked_on: string }>(
      `SELECT DISTINCT w.walked_on::text AS walked_on FROM sightings s JOIN walks w ON w.id = s.walk_id
      WHERE ${filter} AND s.deleted_at IS NULL ORDER BY 1`,
      replacements,
    )
  ).map((w) => w.walked_on);
}
