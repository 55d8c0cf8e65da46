import type { GrowerNoticeSummary, NoticeListState, NoticeMaterial, NoticeStatus } from '../../shared/schemas/notices.ts';
import { execute, selectRow, selectRows, type InTransaction } from './sql.ts';

/** A zone notice: the adviser's message to a farm's grower contacts about one zone set. */
export interface NoticeRow {
  id: string;
  organisationId: string;
  fieldId: string;
  zoneSetId: string;
  checkId: string | null;
  pestId: string;
  recommendation: string;
  /** YYYY-MM-DD */
  rescoutOn: string | null;
  status: NoticeStatus;
  createdBy: string;
  sentAt: Date | null;
  /** The snapshot of what the notice showed when it was sent; null for drafts. */
  material: NoticeMaterial | null;
  createdAt: Date;
  updatedAt: Date;
}

const NOTICE_COLUMNS = `id, organisation_id AS "organisationId", field_id AS "fieldId", zone_set_id AS "zoneSetId", check_id AS "checkId", pest_id AS "pestId",
  recommendation, rescout_on AS "rescoutOn", status, created_by AS "createdBy", sent_at AS "sentAt", material, created_at AS "createdAt", updated_at AS "updatedAt"`;

export const findNoticeById = (id: string, options: InTransaction & { forUpdate?: boolean } = {}) =>
  selectRow<NoticeRow>(`SELECT ${NOTICE_COLUMNS} FROM notices WHERE id = :id${options.forUpdate ? ' FOR UPDATE' : ''}`, { id }, options);

export const findNoticeInOrganisation = (organisationId: string, id: string) =>
  selectRow<NoticeRow>(`SELECT ${NOTICE_COLUMNS} FROM notices WHERE id = :id AND organisation_id = :org`, { id, org: organisationId });

/** The organisation's notices, newest first (200 at most), only one field's when given. */
export const listNoticesOfOrganisation = (organisationId: string, fieldId?: string) =>
  selectRows<NoticeRow>(
    `SELECT ${NOTICE_COLUMNS} FROM notices WHERE organisation_id = :org${fieldId ? ' AND field_id = :fieldId' : ''} ORDER BY created_at DESC LIMIT 200`,
    { org: organisationId, fieldId },
  );

export interface NewNotice {
  organisationId: string;
  fieldId: string;
  zoneSetId: string;
  checkId: string | null;
  pestId: string;
  recommendation: string;
  rescoutOn: string | null;
  createdBy: string;
}

export const insertNotice = async (notice: NewNotice, options: InTransaction = {}) =>
  (await selectRow<{ id: string }>(
    `INSERT INTO notices (organisation_id, field_id, zone_set_id, check_id, pest_id, recommendation, rescout_on, created_by)
     VALUES (:organisationId, :fieldId, :zoneSetId, :checkId, :pestId, :recommendation, :rescoutOn, :createdBy) RETURNING id`,
    { ...notice },
    options,
  ))!.id;

/** A draft goes out: sending from now, with the snapshot every copy, page and map shows. */
export const markNoticeSent = (id: string, material: NoticeMaterial, options: InTransaction = {}) =>
  execute(
    `UPDATE notices SET status = 'sending', sent_at = now(), material = CAST(:material AS jsonb), updated_at = now() WHERE id = :id`,
    { id, material: JSON.stringify(material) },
    options,
  );

export const setNoticeStatus = (id: string, status: NoticeStatus, options: InTransaction = {}) =>
  execute('UPDATE notices SET status = :status, updated_at = now() WHERE id = :id', { id, status }, options);

export interface NoticeNames {
  field_name: string;
  farm_id: string;
  farm_name: string;
  pest_name: string;
  version: number;
  author: string;
}

const NOTICE_NAMES_FROM = `SELECT n.id AS notice_id, f.name AS field_name, fa.id AS farm_id, fa.name AS farm_name, p.name AS pest_name, zs.version, u.name AS author
       FROM notices n JOIN fields f ON f.id = n.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = n.pest_id
       JOIN zone_sets zs ON zs.id = n.zone_set_id JOIN users u ON u.id = n.created_by`;

export const findNoticeNames = async (id: string) => (await selectRow<NoticeNames>(`${NOTICE_NAMES_FROM} WHERE n.id = :id`, { id }))!;

/** The names of several notices (one list) in one query, by notice id. */
export const findNamesOfNotices = async (ids: string[]): Promise<Map<string, NoticeNames>> => {
  if (ids.length === 0) return new Map();
  const rows = await selectRows<NoticeNames & { notice_id: string }>(`${NOTICE_NAMES_FROM} WHERE n.id IN (:ids)`, { ids });
  return new Map(rows.map((row) => [row.notice_id, row]));
};

export interface GrowerNoticeRow {
  id: string;
  farm_name: string;
  field_name: string;
  pest_name: string;
  sent_at: Date | null;
  status: GrowerNoticeSummary['status'];
  zone_count: number;
  treated_m2: number | null;
}

/** Notices sent (not drafts) on the farms linked to a grower, newest first. */
export const listNoticesOfGrower = (organisationId: string, userId: string) =>
  selectRows<GrowerNoticeRow>(
    // A sent notice's snapshot names what it said; notices sent before snapshots fall back to the live rows.
    `SELECT n.id, COALESCE(n.material->'content'->>'farmName', fa.name) AS farm_name, COALESCE(n.material->'content'->>'fieldName', f.name) AS field_name,
            COALESCE(n.material->'content'->>'pestName', p.name) AS pest_name, n.sent_at, n.status,
            COALESCE(jsonb_array_length(n.material->'content'->'zones'), (SELECT count(*) FROM zones z WHERE z.zone_set_id = n.zone_set_id))::int AS zone_count,
            COALESCE((n.material->'content'->>'totalTreatedM2')::float8, (SELECT ST_Area(ST_Union(z.geometry)::geography, true) FROM zones z WHERE z.zone_set_id = n.zone_set_id)) AS treated_m2
       FROM notices n JOIN fields f ON f.id = n.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = n.pest_id
       JOIN farm_growers g ON g.farm_id = fa.id AND g.user_id = :userId
      WHERE n.organisation_id = :org AND n.status <> 'draft' ORDER BY n.sent_at DESC`,
    { userId, org: organisationId },
  );

export interface UnacknowledgedRow {
  id: string;
  field_id: string;
  field_name: string;
  farm_name: string;
  pest_name: string;
  sent_at: Date;
  days: number;
  waiting: number;
}

/** Sent at least `days` days ago and acknowledged by nobody yet, oldest first. */
export const listUnacknowledgedNoticesOfOrganisation = (organisationId: string, days: number) =>
  selectRows<UnacknowledgedRow>(
    `SELECT n.id, n.field_id, f.name AS field_name, fa.name AS farm_name, p.name AS pest_name, n.sent_at,
            floor(EXTRACT(epoch FROM now() - n.sent_at) / 86400)::int AS days,
            (SELECT count(*) FROM notice_recipients r WHERE r.notice_id = n.id AND r.revoked_at IS NULL)::int AS waiting
       FROM notices n JOIN fields f ON f.id = n.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = n.pest_id
      WHERE n.organisation_id = :org AND n.sent_at IS NOT NULL AND n.sent_at <= now() - make_interval(days => :days)
        AND NOT EXISTS (SELECT 1 FROM notice_recipients r WHERE r.notice_id = n.id AND r.acknowledged_at IS NOT NULL)
      ORDER BY n.sent_at`,
    { org: organisationId, days },
  );

export const findNoticeZoneSetRef = (id: string) =>
  selectRow<{ organisation_id: string; zone_set_id: string }>('SELECT organisation_id, zone_set_id FROM notices WHERE id = :id', { id });

/** The sent notice (not a draft) of the organisation, when it is about a farm linked to this grower. */
export const findSentNoticeOfGrower = async (organisationId: string, userId: string, noticeId: string) =>
  (
    await selectRow<{ id: string }>(
      `SELECT n.id FROM notices n JOIN fields f ON f.id = n.field_id
       JOIN farm_growers g ON g.farm_id = f.farm_id AND g.user_id = :userId
      WHERE n.id = :noticeId AND n.organisation_id = :org AND n.status <> 'draft'`,
      { userId, org: organisationId, noticeId },
    )
  )?.id;

export interface NoticeFacts {
  farm_name: string;
  field_name: string;
  field_area_m2: number;
  /** GeoJSON text, outer rings counter-clockwise. */
  boundary: string;
  pest_name: string;
  /** The pest's action threshold, its count unit and source. */
  threshold: number;
  count_unit: string;
  threshold_source: string;
  threshold_confirmed: boolean;
  author: string;
  organisation: string;
  /** The organisation's locale and time zone, for the dates the notice writes. */
  locale: string;
  time_zone: string;
}

/** The live names and field a notice shows. */
export const findNoticeFacts = async (id: string) =>
  (await selectRow<NoticeFacts>(
    `SELECT fa.name AS farm_name, f.name AS field_name, f.area_m2 AS field_area_m2, ST_AsGeoJSON(ST_ForcePolygonCCW(f.boundary), 9) AS boundary,
            p.name AS pest_name, p.action_threshold AS threshold, p.count_unit, p.threshold_source, p.threshold_confirmed,
            u.name AS author, o.name AS organisation, o.locale, o.time_zone
       FROM notices n JOIN fields f ON f.id = n.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = n.pest_id
       JOIN users u ON u.id = n.created_by JOIN organisations o ON o.id = n.organisation_id WHERE n.id = :id`,
    { id },
  ))!;

export const findNoticeVersionStamp = (id: string) =>
  selectRow<{ id: string; updatedAt: Date }>('SELECT id, updated_at AS "updatedAt" FROM notices WHERE id = :id', { id });

export interface NoticeMailNames {
  organisation_id: string;
  field_name: string;
  farm_name: string;
  pest_name: string;
  organisation_name: string;
  adviser_name: string;
  adviser_email: string;
}

/** What a question's e-mails name: the notice's (snapshot, else live) field, farm and pest, its organisation and its adviser. */
export const findNoticeMailNames = async (noticeId: string) =>
  (await selectRow<NoticeMailNames>(
    `SELECT n.organisation_id, COALESCE(n.material->'content'->>'fieldName', f.name) AS field_name, COALESCE(n.material->'content'->>'farmName', fa.name) AS farm_name,
            COALESCE(n.material->'content'->>'pestName', p.name) AS pest_name, o.name AS organisation_name, u.name AS adviser_name, u.email AS adviser_email
       FROM notices n JOIN fields f ON f.id = n.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = n.pest_id
       JOIN organisations o ON o.id = n.organisation_id JOIN users u ON u.id = n.created_by WHERE n.id = :noticeId`,
    { noticeId },
  ))!;

/** One row of the adviser's list of notices, with the live names it is filed under. */
export interface NoticeListRow {
  id: string;
  field_id: string;
  field_name: string;
  farm_id: string;
  farm_name: string;
  pest_name: string;
  version: number;
  status: NoticeStatus;
  created_at: Date;
  sent_at: Date | null;
  /** The notice's date (sent, or written for a draft) as PostgreSQL's own text, microseconds kept, for the page cursor. */
  dated: string;
}

/** Notices that have at least one copy in this state; the fragments are fixed text, never a value from a request. */
const STATE_CONDITIONS: Record<NoticeListState, string> = {
  draft: `n.status = 'draft'`,
  'not-acknowledged': `n.status <> 'draft' AND EXISTS (SELECT 1 FROM notice_recipients r WHERE r.notice_id = n.id AND r.revoked_at IS NULL AND r.acknowledged_at IS NULL)`,
  acknowledged: `EXISTS (SELECT 1 FROM notice_recipients r WHERE r.notice_id = n.id AND r.acknowledged_at IS NOT NULL)`,
  opened: `EXISTS (SELECT 1 FROM notice_recipients r WHERE r.notice_id = n.id AND r.opened_at IS NOT NULL AND r.acknowledged_at IS NULL)`,
  accepted: `EXISTS (SELECT 1 FROM notice_recipients r WHERE r.notice_id = n.id AND r.revoked_at IS NULL AND r.status = 'sent' AND r.opened_at IS NULL)`,
  'on-its-way': `EXISTS (SELECT 1 FROM notice_recipients r WHERE r.notice_id = n.id AND r.revoked_at IS NULL AND r.status IN ('queued', 'sending'))`,
  failed: `EXISTS (SELECT 1 FROM notice_recipients r WHERE r.notice_id = n.id AND r.revoked_at IS NULL AND r.status = 'failed')`,
};

export interface NoticeListFilter {
  organisationId: string;
  /** Only these fields (the actor's visible ones), or every field of the organisation when null. */
  fieldIds: string[] | null;
  farmId?: string;
  fieldId?: string;
  state?: NoticeListState;
  from?: string;
  before?: string;
  /** Strictly after this position in the order (date, then id, both descending). */
  after?: { dated: string; id: string };
  limit: number;
}

/** One page of the organisation's notices, newest first (by the date sent, or written for a draft). */
export function listNoticePage(filter: NoticeListFilter) {
  const where = ['n.organisation_id = :org'];
  if (filter.fieldIds) where.push(filter.fieldIds.length ? 'n.field_id IN (:fieldIds)' : 'false');
  if (filter.farmId) where.push('f.farm_id = :farmId');
  if (filter.fieldId) where.push('n.field_id = :fieldId');
  if (filter.state) where.push(STATE_CONDITIONS[filter.state]);
  if (filter.from) where.push('COALESCE(n.sent_at, n.created_at) >= CAST(:from AS timestamptz)');
  if (filter.before) where.push('COALESCE(n.sent_at, n.created_at) < CAST(:before AS timestamptz)');
  if (filter.after) where.push('(COALESCE(n.sent_at, n.created_at), n.id) < (CAST(:afterDated AS timestamptz), CAST(:afterId AS uuid))');
  return selectRows<NoticeListRow>(
    `SELECT n.id, n.field_id, f.name AS field_name, fa.id AS farm_id, fa.name AS farm_name, p.name AS pest_name, zs.version, n.status, n.created_at, n.sent_at,
            COALESCE(n.sent_at, n.created_at)::text AS dated
       FROM notices n JOIN fields f ON f.id = n.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = n.pest_id
       JOIN zone_sets zs ON zs.id = n.zone_set_id
      WHERE ${where.join(' AND ')}
      ORDER BY COALESCE(n.sent_at, n.created_at) DESC, n.id DESC
      LIMIT :limit`,
    {
      org: filter.organisationId,
      fieldIds: filter.fieldIds,
      farmId: filter.farmId,
      fieldId: filter.fieldId,
      from: filter.from,
      before: filter.before,
      afterDated: filter.after?.dated,
      afterId: filter.after?.id,
      limit: filter.limit,
    },
  );
}
