// The adviser's list of every notice of the organisation with each copy's state: filtered by farm, field, state and
// date, one page at a time. The cursor stays local to notices (a plain limit + position) so a shared pager can replace it.
import type { Actor } from '../auth/passport.ts';
import { findFarmInOrganisation } from '../queries/farms.ts';
import { listNoticePage } from '../queries/notices.ts';
import { listRecipientsOfNotices } from '../queries/notice-recipients.ts';
import { badRequest, notFound } from '../errors.ts';
import { findVisibleField } from './fields.ts';
import { recipientView } from './notice-reading.ts';
import { visibleFarmIds, visibleFieldIds } from './scope.ts';
import type { NoticeListPage, NoticeListQuery } from '../../shared/schemas/notices.ts';
import { isCalendarDate } from '../../shared/schemas/calendar-date.ts';

interface Position {
  dated: string;
  id: string;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
/** PostgreSQL's text of a timestamptz, e.g. 2026-07-01 09:30:00.123456+00. */
const TIMESTAMP = /^(\d{4}-\d{2}-\d{2}) ([01]\d|2[0-3]):[0-5]\d:[0-5]\d(\.\d{1,6})?[+-]\d{2}(:[0-5]\d)?$/;

/** A timestamp the database will read back: a real calendar day and a time of day, so a forged one cannot reach the query. */
const isTimestamp = (text: string) => {
  const parts = TIMESTAMP.exec(text);
  return !!parts && isCalendarDate(parts[1]);
};

export const encodeCursor = (position: Position) => Buffer.from(JSON.stringify([position.dated, position.id])).toString('base64url');

/** The position a cursor names; anything else is refused with a way out rather than read as a query. */
export function decodeCursor(cursor: string): Position {
  try {
    const [dated, id] = JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8')) as unknown[];
    if (typeof dated === 'string' && isTimestamp(dated) && typeof id === 'string' && UUID.test(id)) return { dated, id };
  } catch {
    // Falls through to the one message below.
  }
  throw badRequest('That page cursor is not valid; start again from the first page.', { cursor: 'Start again from the first page.' });
}

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
    after: query.cursor ? decodeCursor(query.cursor) : undefined,
    limit: query.limit + 1,
  });
  const page = rows.slice(0, query.limit);
  const copies = await listRecipientsOfNotices(page.map((n) => n.id));
  return {
    limit: query.limit,
    nextCursor: rows.length > query.limit ? encodeCursor({ dated: page.at(-1)!.dated, id: page.at(-1)!.id }) : null,
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
