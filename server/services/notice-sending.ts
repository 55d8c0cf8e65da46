// Sending a zone notice: queueing one copy per grower contact, re-sending failed copies, each copy's
// status rolled up into the notice's, and withdrawing a copy's link.
import crypto from 'node:crypto';
import type { Transaction } from 'sequelize';
import { sequelize } from '../db.ts';
import { config } from '../config.ts';
import type { Actor } from '../auth/passport.ts';
import { findNoticeById, markNoticeSent, setNoticeStatus } from '../queries/notices.ts';
import {
  findRecipientOfNotice,
  insertRecipient,
  listFailedRecipientIds,
  listRecipientDeliveries,
  requeueRecipients,
  revokeRecipientLink,
} from '../queries/notice-recipients.ts';
import { listContactsOfFieldFarm } from '../queries/farm-contacts.ts';
import { badRequest, conflict, notFound } from '../errors.ts';
import { createQueueOnce, queue } from '../jobs/queue.ts';
import { jobsInTransaction } from '../queries/job-queue.ts';
import { recordAudit } from './audit.ts';
import { findNotice, getNotice } from './notice-reading.ts';
import { liveNoticeMaterial } from './notice-material.ts';
import type { NoticeStatus, DeliveryStatus, NoticeRecipientChoice } from '../../shared/schemas/notices.ts';

export const NOTICE_QUEUE = 'notice-copy';

/** Retries with exponential back-off: 6 attempts over roughly an hour at the defaults (pg-boss doubles the delay each time). */
export const noticeRetryPolicy = { retryLimit: 5, retryDelay: 60, retryBackoff: true };

/** Tests shorten the back-off; production keeps the defaults. */
export function setNoticeRetryPolicy(policy: Partial<typeof noticeRetryPolicy>) {
  Object.assign(noticeRetryPolicy, policy);
}

/** Our own Message-ID, fixed when the copy is queued so that every attempt carries the same one. */
function messageIdFor(noticeId: string, recipientId: string) {
  const domain = /@([^>\s]+)>?\s*$/.exec(config.mailFrom)?.[1] ?? 'patchwise.local';
  return `<notice-${noticeId}.${recipientId}@${domain}>`;
}

interface ChosenRecipient {
  name: string;
  email: string;
  addedForNotice: boolean;
}

/**
 * Who gets the copies: every contact of the farm, or the adviser's choice of them plus addresses added for this
 * notice only. A contact id that is not one of this farm's contacts is refused, never looked up elsewhere.
 */
export function chooseRecipients(contacts: Array<{ id: string; name: string; email: string }>, choice?: NoticeRecipientChoice): ChosenRecipient[] {
  if (!choice) {
    if (contacts.length === 0) throw badRequest('This farm has no grower contacts yet; add one to the farm (name and e-mail), then send the notice.');
    return contacts.map((c) => ({ name: c.name, email: c.email, addedForNotice: false }));
  }
  const kept = [...new Set(choice.contactIds)].map((contactId) => {
    const contact = contacts.find((c) => c.id === contactId);
    if (!contact)
      throw badRequest('One of the chosen contacts is not a contact of this farm (the farm may have just been edited); reload the page and choose again.', {
        contactIds: 'Reload and choose again.',
      });
    return { name: contact.name, email: contact.email, addedForNotice: false };
  });
  const added = choice.added.map((a, i) => {
    const contact = contacts.find((c) => c.email === a.email);
    if (contact)
      throw badRequest(`${a.email} is already a contact of this farm (${contact.name}); keep them in the list instead of adding the address.`, {
        [`added.${i}.email`]: 'Already a contact of this farm.',
      });
    return { name: a.name, email: a.email, addedForNotice: true };
  });
  return [...kept, ...added];
}

/** Queues one copy per chosen recipient (a draft; by default every grower contact of the farm), or the copies that finally failed (a re-send). */
export async function sendNotice(actor: Actor, id: string, choice?: NoticeRecipientChoice) {
  const notice = await findNotice(actor, id);
  if (notice.status === 'sent') throw conflict('This notice has already gone to every grower contact.');
  if (notice.status === 'sending') throw conflict('This notice is being sent; its status updates as each copy goes out.');
  if (choice && notice.status !== 'draft')
    throw badRequest('The recipients were chosen when this notice was first sent; sending again goes to the copies that failed, without a list.');
  // A draft's material becomes the notice's snapshot: what every copy, page and map shows from now on.
  const snapshot = notice.status === 'draft' ? await liveNoticeMaterial(notice) : null;
  const boss = await queue();
  await createQueueOnce(boss, NOTICE_QUEUE);
  // Each copy's job is queued in the same transaction as its recipient row: a process killed half-way leaves both or
  // neither, never a notice stuck at "sending" with a copy nobody will send.
  const queueCopies = async (recipientIds: string[], transaction: Transaction) => {
    const db = jobsInTransaction(transaction);
    for (const recipientId of recipientIds) await boss.send(NOTICE_QUEUE, { recipientId }, { ...noticeRetryPolicy, db });
  };
  await sequelize.transaction(async (transaction) => {
    if (snapshot) {
      const contacts = await listContactsOfFieldFarm(notice.fieldId, { transaction });
      const recipients = chooseRecipients(contacts, choice);
      const ids: string[] = [];
      for (const recipient of recipients) {
        const recipientId = crypto.randomUUID();
        await insertRecipient(
          {
            id: recipientId,
            noticeId: notice.id,
            contactName: recipient.name,
            email: recipient.email,
            messageId: messageIdFor(notice.id, recipientId),
            addedForNotice: recipient.addedForNotice,
          },
          { transaction },
        );
        ids.push(recipientId);
      }
      await markNoticeSent(notice.id, snapshot, { transaction });
      const added = recipients.filter((r) => r.addedForNotice).length;
      await recordAudit(
        actor,
        'send',
        'notice',
        notice.id,
        { recipients: recipients.length, leftOut: contacts.length - (recipients.length - added), added },
        transaction,
      );
      await queueCopies(ids, transaction);
      return;
    }
    const failed = await listFailedRecipientIds(notice.id, { transaction });
    if (failed.length === 0) throw conflict('No copy of this notice is waiting to be sent again.');
    await requeueRecipients(failed, { transaction });
    await setNoticeStatus(notice.id, 'sending', { transaction });
    await recordAudit(actor, 'resend', 'notice', notice.id, { recipients: failed.length }, transaction);
    await queueCopies(failed, transaction);
  });
  return getNotice(actor, id);
}

/** Recomputes a notice's overall status from its copies: sending while any copy may still go out. */
export async function refreshNoticeStatus(noticeId: string) {
  // The notice row is locked first, so two copies finishing at once cannot write their verdicts out of order.
  await sequelize.transaction(async (transaction) => {
    const locked = await findNoticeById(noticeId, { transaction, forUpdate: true });
    if (!locked) return;
    const rows = await listRecipientDeliveries(noticeId, { transaction });
    if (rows.length === 0) return;
    const totalAttempts = noticeRetryPolicy.retryLimit + 1;
    const pending = (s: DeliveryStatus, attempts: number) => s === 'queued' || s === 'sending' || (s === 'failed' && attempts < totalAttempts);
    let status: NoticeStatus;
    if (rows.every((r) => r.status === 'sent')) status = 'sent';
    else if (rows.some((r) => !r.revokedAt && pending(r.status, r.attempts))) status = 'sending';
    else status = 'partly-failed';
    if (locked.status !== status) await setNoticeStatus(noticeId, status, { transaction });
  });
}

/** Withdraws one copy's link; an unsent copy is not sent. */
export async function revokeRecipient(actor: Actor, noticeId: string, recipientId: string) {
  const notice = await findNotice(actor, noticeId);
  const recipient = await findRecipientOfNotice(notice.id, recipientId);
  if (!recipient) throw notFound('That recipient');
  await sequelize.transaction(async (transaction) => {
    if (!recipient.revokedAt) await revokeRecipientLink(recipient.id, { transaction });
    await recordAudit(actor, 'revoke-link', 'notice', notice.id, { recipientId }, transaction);
  });
  return getNotice(actor, noticeId);
}
