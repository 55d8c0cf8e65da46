// Read models of zone notices: the adviser's list and view with each copy's state, the grower's list, and the
// unacknowledged notices for the attention list.
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import type { Actor } from '../auth/passport.ts';
import { Notice } from '../models/notice.ts';
import { NoticeRecipient } from '../models/notice-recipient.ts';
import { notFound } from '../errors.ts';
import { findVisibleField } from './fields.ts';
import type { NoticeView, RecipientState, RecipientView, UnacknowledgedNotice, GrowerNoticeSummary, NoticeStatus } from '../../shared/schemas/notices.ts';

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export function recipientState(r: Pick<NoticeRecipient, 'status' | 'openedAt' | 'acknowledgedAt'>): RecipientState {
  if (r.acknowledgedAt) return 'acknowledged';
  if (r.openedAt) return 'opened';
  return r.status;
}

function recipientView(r: NoticeRecipient): RecipientView {
  return {
    id: r.id,
    name: r.contactName,
    email: r.email,
    state: recipientState(r),
    delivery: r.status,
    attempts: r.attempts,
    lastError: r.lastError ?? null,
    smtpAcceptedAt: iso(r.smtpAcceptedAt ?? null),
    openedAt: iso(r.openedAt ?? null),
    acknowledgedAt: iso(r.acknowledgedAt ?? null),
    revokedAt: iso(r.revokedAt ?? null),
    linkExpiresAt: iso(r.tokenExpiresAt ?? null),
  };
}

/** A notice of the actor's organisation on a field the actor may see; anything else is not found. */
export async function findNotice(actor: Actor, id: string) {
  const notice = await Notice.findOne({ where: { id, organisationId: actor.organisationId } });
  if (!notice) throw notFound('That notice');
  await findVisibleField(actor, notice.fieldId).catch(() => {
    throw notFound('That notice');
  });
  return notice;
}

export async function getNotice(actor: Actor, id: string): Promise<NoticeView> {
  const notice = await findNotice(actor, id);
  return noticeView(notice);
}

/** The organisation's notices, newest first, optionally for one field. */
export async function listNotices(actor: Actor, filter: { fieldId?: string } = {}): Promise<NoticeView[]> {
  if (filter.fieldId) await findVisibleField(actor, filter.fieldId);
  const notices = await Notice.findAll({
    where: { organisationId: actor.organisationId, ...(filter.fieldId ? { fieldId: filter.fieldId } : {}) },
    order: [['createdAt', 'DESC']],
    limit: 200,
  });
  return Promise.all(notices.map(noticeView));
}

async function noticeView(notice: Notice): Promise<NoticeView> {
  const [names] = await sequelize.query<{ field_name: string; farm_id: string; farm_name: string; pest_name: string; version: number; author: string }>(
    `SELECT f.name AS field_name, fa.id AS farm_id, fa.name AS farm_name, p.name AS pest_name, zs.version, u.name AS author
       FROM notices n JOIN fields f ON f.id = n.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = n.pest_id
       JOIN zone_sets zs ON zs.id = n.zone_set_id JOIN users u ON u.id = n.created_by WHERE n.id = :id`,
    { replacements: { id: notice.id }, type: QueryTypes.SELECT },
  );
  const recipients = await NoticeRecipient.findAll({ where: { noticeId: notice.id }, order: [['contactName', 'ASC']] });
  return {
    id: notice.id,
    fieldId: notice.fieldId,
    fieldName: names.field_name,
    farmId: names.farm_id,
    farmName: names.farm_name,
    pestId: notice.pestId,
    pestName: names.pest_name,
    zoneSetId: notice.zoneSetId,
    zoneSetVersion: names.version,
    checkId: notice.checkId,
    recommendation: notice.recommendation,
    rescoutOn: notice.rescoutOn,
    status: notice.status,
    createdBy: { id: notice.createdBy, name: names.author },
    createdAt: notice.createdAt.toISOString(),
    sentAt: iso(notice.sentAt ?? null),
    recipients: recipients.map(recipientView),
  };
}

/** A grower's view: notices (sent ones only) on the farms linked to their account, with their own copy's state. */
export async function listGrowerNotices(actor: Actor): Promise<GrowerNoticeSummary[]> {
  const rows = await sequelize.query<{
    id: string;
    farm_name: string;
    field_name: string;
    pest_name: string;
    sent_at: Date | null;
    status: NoticeStatus;
    zone_count: number;
    treated_m2: number | null;
  }>(
    // A sent notice's snapshot names what it said; notices sent before snapshots fall back to the live rows.
    `SELECT n.id, COALESCE(n.material->'content'->>'farmName', fa.name) AS farm_name, COALESCE(n.material->'content'->>'fieldName', f.name) AS field_name,
            COALESCE(n.material->'content'->>'pestName', p.name) AS pest_name, n.sent_at, n.status,
            COALESCE(jsonb_array_length(n.material->'content'->'zones'), (SELECT count(*) FROM zones z WHERE z.zone_set_id = n.zone_set_id))::int AS zone_count,
            COALESCE((n.material->'content'->>'totalTreatedM2')::float8, (SELECT ST_Area(ST_Union(z.geometry)::geography, true) FROM zones z WHERE z.zone_set_id = n.zone_set_id)) AS treated_m2
       FROM notices n JOIN fields f ON f.id = n.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = n.pest_id
       JOIN farm_growers g ON g.farm_id = fa.id AND g.user_id = :userId
      WHERE n.organisation_id = :org AND n.status <> 'draft' ORDER BY n.sent_at DESC`,
    { replacements: { userId: actor.id, org: actor.organisationId }, type: QueryTypes.SELECT },
  );
  const copies = rows.length ? await NoticeRecipient.findAll({ where: { noticeId: rows.map((r) => r.id), email: actor.email.toLowerCase() } }) : [];
  return rows.map((r) => {
    const copy = copies.find((c) => c.noticeId === r.id);
    return {
      id: r.id,
      farmName: r.farm_name,
      fieldName: r.field_name,
      pestName: r.pest_name,
      sentAt: iso(r.sent_at),
      status: r.status,
      zoneCount: r.zone_count,
      totalTreatedM2: r.treated_m2 ?? 0,
      myCopy: copy ? { state: recipientState(copy), openedAt: iso(copy.openedAt ?? null), acknowledgedAt: iso(copy.acknowledgedAt ?? null) } : null,
    };
  });
}

/**
 * Sent notices nobody has acknowledged yet, oldest first, for the adviser's attention list
 * (called by the attention service; exported here until that list takes it in).
 */
export async function listUnacknowledgedNotices(actor: Actor, olderThanDays = 0): Promise<UnacknowledgedNotice[]> {
  if (actor.role !== 'admin' && actor.role !== 'adviser') return [];
  const rows = await sequelize.query<{
    id: string;
    field_id: string;
    field_name: string;
    farm_name: string;
    pest_name: string;
    sent_at: Date;
    days: number;
    waiting: number;
  }>(
    `SELECT n.id, n.field_id, f.name AS field_name, fa.name AS farm_name, p.name AS pest_name, n.sent_at,
            floor(EXTRACT(epoch FROM now() - n.sent_at) / 86400)::int AS days,
            (SELECT count(*) FROM notice_recipients r WHERE r.notice_id = n.id AND r.revoked_at IS NULL)::int AS waiting
       FROM notices n JOIN fields f ON f.id = n.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = n.pest_id
      WHERE n.organisation_id = :org AND n.sent_at IS NOT NULL AND n.sent_at <= now() - make_interval(days => :days)
        AND NOT EXISTS (SELECT 1 FROM notice_recipients r WHERE r.notice_id = n.id AND r.acknowledged_at IS NOT NULL)
      ORDER BY n.sent_at`,
    { replacements: { org: actor.organisationId, days: olderThanDays }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    noticeId: r.id,
    fieldId: r.field_id,
    fieldName: r.field_name,
    farmName: r.farm_name,
    pestName: r.pest_name,
    sentAt: r.sent_at.toISOString(),
    daysSinceSent: r.days,
    recipientsWaiting: r.waiting,
    message: `The ${r.pest_name} notice for ${r.field_name} (${r.farm_name}) went out ${r.days === 0 ? 'today' : `${r.days} day${r.days === 1 ? '' : 's'} ago`} and no grower has acknowledged it yet.`,
  }));
}
