// The grower's link to one notice: "<recipient id>.<random secret>". Only a sha256 of the whole token is
// stored; the raw token exists in the e-mailed link alone. The recipient id lets a wrong secret be refused
// without scanning, and ties the token to its own copy of its own notice.
import crypto from 'node:crypto';
import type { Transaction } from 'sequelize';
import { AppError } from '../errors.ts';
import { findNoticeById, findNoticeVersionStamp } from '../queries/notices.ts';
import {
  findLinkableRecipient,
  findRecipientAcknowledgedAt,
  findRecipientOpenedAt,
  markRecipientAcknowledged,
  markRecipientOpened,
  setRecipientToken,
} from '../queries/notice-recipients.ts';
import { noticeMaterial } from './notice-material.ts';
import { renderNoticeMap } from './notice-map.ts';
import { cachedNoticeMap } from './notice-map-cache.ts';
import { noticeMachineFilePaths } from './zone-files/zone-machine-files.ts';
import type { NoticeLinkResponse } from '../../shared/schemas/notices.ts';
import { readerQuestions, type Asker } from './notice-questions.ts';

/** Common practice for such links: long enough for a season's re-scout, short enough to go stale. */
export const NOTICE_LINK_DAYS = 60;

const sha256 = (text: string) => crypto.createHash('sha256').update(text).digest('hex');
const TOKEN_SHAPE = /^([0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})\.([A-Za-z0-9_-]{43})$/;

export const linkRefused = () =>
  new AppError(
    404,
    'notice_link_not_found',
    'This notice link is not valid: it may have expired or been withdrawn. Ask your adviser to send the notice again.',
  );

/** A fresh token for a recipient (replacing any earlier one); returns the raw token for the e-mail. */
export async function issueNoticeToken(recipientId: string, transaction?: Transaction): Promise<string> {
  const token = `${recipientId}.${crypto.randomBytes(32).toString('base64url')}`;
  await setRecipientToken(recipientId, sha256(token), NOTICE_LINK_DAYS, { transaction });
  return token;
}

export interface LinkedCopy {
  recipientId: string;
  noticeId: string;
  contactName: string;
  email: string;
  openedAt: Date | null;
  acknowledgedAt: Date | null;
}

/** The recipient copy a token opens; expired, revoked, tampered and mismatched tokens all get the same 404. */
export async function resolveNoticeToken(token: string): Promise<LinkedCopy> {
  const shape = TOKEN_SHAPE.exec(token);
  if (!shape) throw linkRefused();
  const row = await findLinkableRecipient(shape[1]);
  if (!row?.token_hash) throw linkRefused();
  const given = Buffer.from(sha256(token), 'hex');
  if (!crypto.timingSafeEqual(given, Buffer.from(row.token_hash, 'hex'))) throw linkRefused();
  return {
    recipientId: row.id,
    noticeId: row.notice_id,
    contactName: row.contact_name,
    email: row.email,
    openedAt: row.opened_at,
    acknowledgedAt: row.acknowledged_at,
  };
}

/** Records the first opening of the notice page; later openings change nothing and answer with the first one's time. */
export async function markOpened(recipientId: string): Promise<{ openedAt: Date; alreadyOpened: boolean }> {
  const openedAt = await markRecipientOpened(recipientId);
  if (openedAt) return { openedAt, alreadyOpened: false };
  return { openedAt: await findRecipientOpenedAt(recipientId), alreadyOpened: true };
}

/** Records the acknowledgement once; a second one answers with the first one's time. */
export async function acknowledge(recipientId: string): Promise<{ acknowledgedAt: Date; alreadyAcknowledged: boolean }> {
  const acknowledgedAt = await markRecipientAcknowledged(recipientId);
  if (acknowledgedAt) return { acknowledgedAt, alreadyAcknowledged: false };
  return { acknowledgedAt: await findRecipientAcknowledgedAt(recipientId), alreadyAcknowledged: true };
}

/** What the notice page shows of one notice to one reader: the copy's contact, or a signed-in grower of the farm. */
/** `basePath` is the reader's path to this notice, under which its map image and zone files are served. */
export async function noticePageContent(
  noticeId: string,
  reader: { name: string; acknowledgedAt: Date | null; asker: Asker },
  basePath: string,
): Promise<NoticeLinkResponse['notice']> {
  const material = await noticeMaterial(noticeId);
  const questions = await readerQuestions(noticeId, reader.asker);
  const notice = await findNoticeById(noticeId);
  return {
    ...material.content,
    sentAt: notice?.sentAt ? notice.sentAt.toISOString() : null,
    recipientName: reader.name,
    acknowledgedAt: reader.acknowledgedAt ? reader.acknowledgedAt.toISOString() : null,
    zonesGeoJson: material.zonesGeoJson,
    boundary: material.boundary,
    sightings: material.sightings,
    mapPath: `${basePath}/map.png`,
    zoneFiles: noticeMachineFilePaths(basePath),
    questions,
  };
}

/** What the notice page shows for a token; reading it changes nothing (the page reports its opening itself). */
export async function noticeForLink(token: string): Promise<NoticeLinkResponse['notice']> {
  const copy = await resolveNoticeToken(token);
  return noticePageContent(
    copy.noticeId,
    { name: copy.contactName, acknowledgedAt: copy.acknowledgedAt, asker: linkAsker(copy) },
    `/api/notice-links/${token}`,
  );
}

/** The contact of a copy, asking through its link. */
export const linkAsker = (copy: LinkedCopy): Asker => ({ name: copy.contactName, email: copy.email, recipientId: copy.recipientId, userId: null });

/** A notice's map image, as the e-mail and the notice page carry it: drawn once per notice version. */
export async function noticeMapImage(noticeId: string): Promise<Buffer> {
  const notice = await findNoticeVersionStamp(noticeId);
  if (!notice) throw linkRefused();
  return cachedNoticeMap(notice.id, notice.updatedAt, async () => {
    const material = await noticeMaterial(noticeId);
    return renderNoticeMap({ boundary: material.boundary, zones: material.zones, sightings: material.sightings });
  });
}

/** The notice's map for a token (does not count as an opening: mail programs fetch images by themselves). */
export async function mapForLink(token: string): Promise<Buffer> {
  const copy = await resolveNoticeToken(token);
  return noticeMapImage(copy.noticeId);
}
