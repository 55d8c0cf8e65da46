// The adviser's list of every notice of the organisation with each copy's state: filtered by farm, field, state and
// date, one page at a time (the keyset cursor of services/page-cursor.ts on the notice's date and id).
import type { Actor } from '../auth/passport.ts';
import { findFarmInOrganisation } from '../queries/farms.ts';
import { listNoticePage } from '../queries/notices.ts';
import { listRecipientsOfNotices } from '../queries/notice-recipients.ts';
import { notFound } from '../errors.ts';
import { findVisibleField } from './fields.ts';
import { recipientView } from './notice-reading.ts';
import { visibleFarmIds, visibleFieldIds } from './scope.ts';
import type { NoticeListPage, NoticeListQuery } from '../../shared/schemas/notices.ts';
import { decodePageCursor, pageOf, type CursorPart } from './page-cursor.ts';

/** A notice's page key: its date (sent, or written for a draft), then its id. */
const NOTICE_KEY_PARTS: CursorPart[] = ['timestamp', 'uuid'];
const toPosition = ([dated, id]: string[]) => ({ dated, id });

export async function listNoticeOverview(actor: Actor, query: NoticeListQuery): Promise<NoticeListPage> {
  if (query.fieldId) await findVisibleField(actor, query.fieldId);
  if (query.farmId) {
    const farms = await visibleFarmIds(actor);
    if ((farms && !farms.includes(query.farmId)) || !(await findFarmInOrganisation(actor.organisationId, query.farmId))) throw notFound('That farm');
  }
  // One row more than the page tells whether another page follows.
  const rows = await listNoticePage({
    organisationId: actor.organisationId,
    fieldIds: await visibleFieldIds(actor),
    farmId: query.farmId,
    fieldId: query.fieldId,
    state: query.state,
    from: query.from,
    before: query.before,
    after: query.cursor ? toPosition(decodePageCursor(query.cursor, NOTICE_KEY_PARTS)) : undefined,
    limit: query.limit + 1,
  });
  const { page, nextCursor } = pageOf(rows, query.limit, (n) => [n.dated, n.id]);
  const copies = await listRecipientsOfNotices(page.map((n) => n.id));
  return {
    limit: query.limit,
    nextCursor,
    notices: page.map((n) => ({
      id: n.id,
      fieldId: n.field_id,
      fieldName: n.field_name,
      farmId: n.farm_id,
      farmName: n.farm_name,
      pestName: n.pest_name,
      zoneSetVersion: n.version,
      status: n.status,
      createdAt: n.created_at.toISOString(),
      sentAt: n.sent_at ? n.sent_at.toISOString() : null,
      recipients: copies.filter((c) => c.noticeId === n.id).map(recipientView),
    })),
  };
}
