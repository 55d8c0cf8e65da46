// Read models of zone notices: the adviser's list and view with each copy's state, the grower's list, and the
// unacknowledged notices for the attention list.
import type { Actor } from '../auth/passport.ts';
import * as notices from '../queries/notices.ts';
import { listCopiesForEmail, listRecipientsOfNotice, listRecipientsOfNotices, type NoticeRecipientRow } from '../queries/notice-recipients.ts';
import { notFound } from '../errors.ts';
import { findVisibleField } from './fields.ts';
import type { NoticeView, RecipientState, RecipientView, UnacknowledgedNotice, GrowerNoticeSummary } from '../../shared/schemas/notices.ts';

const iso = (d: Date | null) => (d ? d.toISOString() : null);

export function recipientState(r: Pick<NoticeRecipientRow, 'status' | 'openedAt' | 'acknowledgedAt'>): RecipientState {
  if (r.acknowledgedAt) return 'acknowledged';
  if (r.openedAt) return 'opened';
  return r.status;
}

export function recipientView(r: NoticeRecipientRow): RecipientView {
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
    addedForNotice: r.addedForNotice ?? false,
  };
}

/** A notice of the actor's organisation on a field the actor may see; anything else is not found. */
export async function findNotice(actor: Actor, id: string) {
  const notice = await notices.findNoticeInOrganisation(actor.organisationId, id);
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
  const rows = await notices.listNoticesOfOrganisation(actor.organisationId, filter.fieldId);
  // Three queries for the whole list, not two per notice.
  const ids = rows.map((n) => n.id);
  const [names, copies] = await Promise.all([notices.findNamesOfNotices(ids), listRecipientsOfNotices(ids)]);
  const copiesByNotice = new Map<string, NoticeRecipientRow[]>(ids.map((id) => [id, []]));
  for (const copy of copies) copiesByNotice.get(copy.noticeId)!.push(copy);
  return rows.map((notice) => noticeViewOf(notice, names.get(notice.id)!, copiesByNotice.get(notice.id)!));
}

async function noticeView(notice: notices.NoticeRow): Promise<NoticeView> {
  const [names, recipients] = await Promise.all([notices.findNoticeNames(notice.id), listRecipientsOfNotice(notice.id)]);
  return noticeViewOf(notice, names, recipients);
}

function noticeViewOf(notice: notices.NoticeRow, names: notices.NoticeNames, recipients: NoticeRecipientRow[]): NoticeView {
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
  const rows = await notices.listNoticesOfGrower(actor.organisationId, actor.id);
  const copies = await listCopiesForEmail(
    rows.map((r) => r.id),
    actor.email.toLowerCase(),
  );
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
  const rows = await notices.listUnacknowledgedNoticesOfOrganisation(actor.organisationId, olderThanDays);
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
