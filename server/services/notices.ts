// Zone notices: drafts, what they say, queueing one copy per grower contact, and each copy's status.
import crypto from 'node:crypto';
import { QueryTypes } from 'sequelize';
import type { MultiPolygon, Position } from 'geojson';
import { sequelize } from '../db.ts';
import { config } from '../config.ts';
import type { Actor } from '../auth/passport.ts';
import { Notice } from '../models/notice.ts';
import { NoticeRecipient } from '../models/notice-recipient.ts';
import { ZoneSet } from '../models/zone-set.ts';
import { PatternCheck } from '../models/pattern-check.ts';
import { badRequest, conflict, notFound } from '../errors.ts';
import { queue } from '../jobs/queue.ts';
import { recordAudit } from './audit.ts';
import { findVisibleField } from './fields.ts';
import { zoneSetInOrganisation } from './zone-sets.ts';
import { zonesGeoJson } from './zone-export.ts';
import { NOTICE_CAUTIONS } from '../../shared/notices/cautions.ts';
import { verdictInWords } from '../../shared/notices/verdict-words.ts';
import type { NoticeContent, NoticeCreateRequest, NoticeView, RecipientState, RecipientView, UnacknowledgedNotice, GrowerNoticeSummary, NoticeStatus, DeliveryStatus } from '../../shared/schemas/notices.ts';

export const NOTICE_QUEUE = 'notice-copy';

/** Retries with exponential back-off: 6 attempts over roughly an hour at the defaults (pg-boss doubles the delay each time). */
export const noticeRetryPolicy = { retryLimit: 5, retryDelay: 60, retryBackoff: true };

/** Tests shorten the back-off; production keeps the defaults. */
export function setNoticeRetryPolicy(policy: Partial<typeof noticeRetryPolicy>) {
  Object.assign(noticeRetryPolicy, policy);
}

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

async function findNotice(actor: Actor, id: string) {
  const notice = await Notice.findOne({ where: { id, organisationId: actor.organisationId } });
  if (!notice) throw notFound('That notice');
  await findVisibleField(actor, notice.fieldId).catch(() => {
    throw notFound('That notice');
  });
  return notice;
}

export async function createNotice(actor: Actor, input: NoticeCreateRequest) {
  await findVisibleField(actor, input.fieldId);
  const zoneSet = await ZoneSet.findOne({ where: { id: input.zoneSetId, organisationId: actor.organisationId } });
  if (!zoneSet || zoneSet.fieldId !== input.fieldId) throw badRequest('Choose zones accepted for this field.', { zoneSetId: 'Those zones are not for this field.' });
  if (zoneSet.status !== 'accepted') throw badRequest(`Zones version ${zoneSet.version} has been replaced by a newer version; write the notice for the current zones.`, { zoneSetId: 'Those zones have been superseded.' });
  const checkId = input.checkId ?? zoneSet.checkId;
  if (checkId) {
    const check = await PatternCheck.findOne({ where: { id: checkId, organisationId: actor.organisationId } });
    if (!check || check.fieldId !== input.fieldId || check.pestId !== zoneSet.pestId) throw badRequest('That check is for another field or pest.', { checkId: 'That check is for another field or pest.' });
  }
  const notice = await sequelize.transaction(async (transaction) => {
    const created = await Notice.create(
      { organisationId: actor.organisationId, fieldId: input.fieldId, zoneSetId: zoneSet.id, checkId: checkId ?? null, pestId: zoneSet.pestId, recommendation: input.recommendation, rescoutOn: input.rescoutOn ?? null, createdBy: actor.id },
      { transaction },
    );
    await recordAudit(actor, 'create', 'notice', created.id, { fieldId: input.fieldId, zoneSetId: zoneSet.id }, transaction);
    return created;
  });
  return getNotice(actor, notice.id);
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

export interface NoticeMaterial {
  content: NoticeContent;
  boundary: MultiPolygon;
  zonesGeoJson: ReturnType<typeof zonesGeoJson>;
  sightings: Position[];
  zones: Array<{ label: string; geometry: MultiPolygon }>;
}

/** Everything a notice shows, gathered once for the e-mail, the preview and the notice page. */
export async function noticeMaterial(noticeId: string): Promise<NoticeMaterial> {
  const notice = await Notice.findByPk(noticeId);
  if (!notice) throw notFound('That notice');
  const [facts] = await sequelize.query<{ farm_name: string; field_name: string; field_area_m2: number; boundary: string; pest_name: string; author: string; organisation: string }>(
    `SELECT fa.name AS farm_name, f.name AS field_name, f.area_m2 AS field_area_m2, ST_AsGeoJSON(ST_ForcePolygonCCW(f.boundary), 9) AS boundary,
            p.name AS pest_name, u.name AS author, o.name AS organisation
       FROM notices n JOIN fields f ON f.id = n.field_id JOIN farms fa ON fa.id = f.farm_id JOIN pests p ON p.id = n.pest_id
       JOIN users u ON u.id = n.created_by JOIN organisations o ON o.id = n.organisation_id WHERE n.id = :id`,
    { replacements: { id: noticeId }, type: QueryTypes.SELECT },
  );
  const check = notice.checkId ? await PatternCheck.findByPk(notice.checkId) : null;
  const zoneSet = await zoneSetInOrganisation(notice.organisationId, notice.zoneSetId);
  if (!zoneSet) throw notFound('The zones of that notice');
  // The sightings behind the notice: the check's own, or (hand-drawn zones) the field's sightings of the pest.
  const sightingFilter = check ? 's.id = ANY(CAST(:ids AS uuid[]))' : 's.field_id = :fieldId AND s.pest_id = :pestId';
  const replacements = { ids: check ? `{${check.sightingIds.join(',')}}` : '{}', fieldId: notice.fieldId, pestId: notice.pestId };
  const walks = await sequelize.query<{ walked_on: string }>(
    `SELECT DISTINCT w.walked_on::text AS walked_on FROM sightings s JOIN walks w ON w.id = s.walk_id
      WHERE ${sightingFilter} AND s.deleted_at IS NULL ORDER BY 1`,
    { replacements, type: QueryTypes.SELECT },
  );
  const points = await sequelize.query<{ lon: number; lat: number }>(
    `SELECT ST_X(s.position) AS lon, ST_Y(s.position) AS lat FROM sightings s
      WHERE ${sightingFilter} AND s.deleted_at IS NULL AND s.status = 'placed' AND (s.count IS NULL OR s.count > 0)`,
    { replacements, type: QueryTypes.SELECT },
  );
  const content: NoticeContent = {
    farmName: facts.farm_name,
    fieldName: facts.field_name,
    fieldAreaM2: facts.field_area_m2,
    pestName: facts.pest_name,
    walkDates: walks.map((w) => w.walked_on),
    verdict: verdictInWords(check?.result ?? null),
    zones: zoneSet.zones.map((z) => ({ label: z.label, areaM2: z.areaM2, areaHa: z.areaHa, areaAc: z.areaAc, shareOfField: z.shareOfField, sightingsInside: z.sightingsInside })),
    totalTreatedM2: zoneSet.totalTreatedM2,
    untreatedShare: zoneSet.untreatedShare,
    recommendation: notice.recommendation,
    rescoutOn: notice.rescoutOn,
    adviserName: facts.author,
    organisationName: facts.organisation,
    cautions: NOTICE_CAUTIONS,
  };
  return {
    content,
    boundary: JSON.parse(facts.boundary) as MultiPolygon,
    zonesGeoJson: zonesGeoJson(zoneSet),
    sightings: points.map((p) => [p.lon, p.lat]),
    zones: zoneSet.zones.map((z) => ({ label: z.label, geometry: z.geometry })),
  };
}

/** Our own Message-ID, fixed when the copy is queued so that every attempt carries the same one. */
function messageIdFor(noticeId: string, recipientId: string) {
  const domain = /@([^>\s]+)>?\s*$/.exec(config.mailFrom)?.[1] ?? 'patchwise.local';
  return `<notice-${noticeId}.${recipientId}@${domain}>`;
}

/** Queues one copy per grower contact of the farm (a draft), or the copies that finally failed (a re-send). */
export async function sendNotice(actor: Actor, id: string) {
  const notice = await findNotice(actor, id);
  if (notice.status === 'sent') throw conflict('This notice has already gone to every grower contact.');
  if (notice.status === 'sending') throw conflict('This notice is being sent; its status updates as each copy goes out.');
  const toQueue = await sequelize.transaction(async (transaction) => {
    if (notice.status === 'draft') {
      const contacts = await sequelize.query<{ name: string; email: string }>(
        `SELECT c.name, c.email FROM farm_contacts c JOIN fields f ON f.farm_id = c.farm_id WHERE f.id = :fieldId ORDER BY c.name`,
        { replacements: { fieldId: notice.fieldId }, type: QueryTypes.SELECT, transaction },
      );
      if (contacts.length === 0) throw badRequest('This farm has no grower contacts yet; add one to the farm (name and e-mail), then send the notice.');
      const ids: string[] = [];
      for (const contact of contacts) {
        const recipientId = crypto.randomUUID();
        await NoticeRecipient.create({ id: recipientId, noticeId: notice.id, contactName: contact.name, email: contact.email, messageId: messageIdFor(notice.id, recipientId) }, { transaction });
        ids.push(recipientId);
      }
      await notice.update({ status: 'sending', sentAt: new Date() }, { transaction });
      await recordAudit(actor, 'send', 'notice', notice.id, { recipients: contacts.length }, transaction);
      return ids;
    }
    const failed = await NoticeRecipient.findAll({ where: { noticeId: notice.id, status: 'failed', revokedAt: null }, transaction });
    if (failed.length === 0) throw conflict('No copy of this notice is waiting to be sent again.');
    await NoticeRecipient.update({ status: 'queued', attempts: 0, lastError: null }, { where: { id: failed.map((r) => r.id) }, transaction });
    await notice.update({ status: 'sending' }, { transaction });
    await recordAudit(actor, 'resend', 'notice', notice.id, { recipients: failed.length }, transaction);
    return failed.map((r) => r.id);
  });
  // Jobs go in after the commit so a worker always finds its recipient row.
  const boss = await queue();
  await boss.createQueue(NOTICE_QUEUE);
  for (const recipientId of toQueue) await boss.send(NOTICE_QUEUE, { recipientId }, { ...noticeRetryPolicy });
  return getNotice(actor, id);
}

/** Recomputes a notice's overall status from its copies: sending while any copy may still go out. */
export async function refreshNoticeStatus(noticeId: string) {
  // The notice row is locked first, so two copies finishing at once cannot write their verdicts out of order.
  await sequelize.transaction(async (transaction) => {
    const locked = await Notice.findByPk(noticeId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!locked) return;
    const rows = await NoticeRecipient.findAll({ where: { noticeId }, attributes: ['status', 'attempts', 'revokedAt'], transaction });
    if (rows.length === 0) return;
    const totalAttempts = noticeRetryPolicy.retryLimit + 1;
    const pending = (s: DeliveryStatus, attempts: number) => s === 'queued' || s === 'sending' || (s === 'failed' && attempts < totalAttempts);
    let status: NoticeStatus;
    if (rows.every((r) => r.status === 'sent')) status = 'sent';
    else if (rows.some((r) => !r.revokedAt && pending(r.status, r.attempts))) status = 'sending';
    else status = 'partly-failed';
    if (locked.status !== status) await locked.update({ status }, { transaction });
  });
}

/** Withdraws one copy's link; an unsent copy is not sent. */
export async function revokeRecipient(actor: Actor, noticeId: string, recipientId: string) {
  const notice = await findNotice(actor, noticeId);
  const recipient = await NoticeRecipient.findOne({ where: { id: recipientId, noticeId: notice.id } });
  if (!recipient) throw notFound('That recipient');
  await sequelize.transaction(async (transaction) => {
    if (!recipient.revokedAt) await recipient.update({ revokedAt: new Date() }, { transaction });
    await recordAudit(actor, 'revoke-link', 'notice', notice.id, { recipientId }, transaction);
  });
  return getNotice(actor, noticeId);
}

/** A grower's view: notices (sent ones only) on the farms linked to their account, with their own copy's state. */
export async function listGrowerNotices(actor: Actor): Promise<GrowerNoticeSummary[]> {
  const rows = await sequelize.query<{ id: string; farm_name: string; field_name: string; pest_name: string; sent_at: Date | null; status: NoticeStatus; zone_count: number; treated_m2: number | null }>(
    `SELECT n.id, fa.name AS farm_name, f.name AS field_name, p.name AS pest_name, n.sent_at, n.status,
            (SELECT count(*) FROM zones z WHERE z.zone_set_id = n.zone_set_id)::int AS zone_count,
            (SELECT ST_Area(ST_Union(z.geometry)::geography, true) FROM zones z WHERE z.zone_set_id = n.zone_set_id) AS treated_m2
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
  const rows = await sequelize.query<{ id: string; field_id: string; field_name: string; farm_name: string; pest_name: string; sent_at: Date; days: number; waiting: number }>(
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
