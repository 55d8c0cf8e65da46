import type { DeliveryStatus } from '../../shared/schemas/notices.ts';
import { execute, selectRow, selectRows, type InTransaction } from './sql.ts';

/** One grower contact's copy of a notice: delivery, link token (hash only) and reading. */
export interface NoticeRecipientRow {
  id: string;
  noticeId: string;
  contactName: string;
  email: string;
  tokenHash: string | null;
  tokenExpiresAt: Date | null;
  revokedAt: Date | null;
  status: DeliveryStatus;
  attempts: number;
  lastError: string | null;
  /** Our own Message-ID header value, fixed when the copy is queued so every attempt sends the same one. */
  messageId: string;
  smtpAcceptedAt: Date | null;
  openedAt: Date | null;
  acknowledgedAt: Date | null;
  /** An address added for this notice only, not one of the farm's contacts. */
  addedForNotice: boolean;
  createdAt: Date;
  updatedAt: Date;
}

const RECIPIENT_COLUMNS = `id, notice_id AS "noticeId", contact_name AS "contactName", email, token_hash AS "tokenHash", token_expires_at AS "tokenExpiresAt",
  revoked_at AS "revokedAt", status, attempts, last_error AS "lastError", message_id AS "messageId", smtp_accepted_at AS "smtpAcceptedAt",
  opened_at AS "openedAt", acknowledged_at AS "acknowledgedAt", added_for_notice AS "addedForNotice", created_at AS "createdAt", updated_at AS "updatedAt"`;

/** A notice's copies by contact name. */
export const listRecipientsOfNotice = (noticeId: string, options: InTransaction = {}) =>
  selectRows<NoticeRecipientRow>(
    `SELECT ${RECIPIENT_COLUMNS} FROM notice_recipients WHERE notice_id = :noticeId ORDER BY contact_name ASC`,
    { noticeId },
    options,
  );

/** The copies of these notices (one page of the adviser's list), by contact name. */
export const listRecipientsOfNotices = (noticeIds: string[]) =>
  noticeIds.length
    ? selectRows<NoticeRecipientRow>(
        `SELECT ${RECIPIENT_COLUMNS} FROM notice_recipients WHERE notice_id IN (:noticeIds) ORDER BY contact_name ASC, email ASC`,
        {
          noticeIds,
        },
      )
    : Promise.resolve([]);

/** The copies addressed to this e-mail among these notices. */
export const listCopiesForEmail = (noticeIds: string[], email: string) =>
  noticeIds.length
    ? selectRows<NoticeRecipientRow>(`SELECT ${RECIPIENT_COLUMNS} FROM notice_recipients WHERE notice_id IN (:noticeIds) AND email = :email`, {
        noticeIds,
        email,
      })
    : Promise.resolve([]);

export const findCopyForEmail = (noticeId: string, email: string) =>
  selectRow<NoticeRecipientRow>(`SELECT ${RECIPIENT_COLUMNS} FROM notice_recipients WHERE notice_id = :noticeId AND email = :email LIMIT 1`, {
    noticeId,
    email,
  });

export const findRecipientOfNotice = (noticeId: string, id: string) =>
  selectRow<NoticeRecipientRow>(`SELECT ${RECIPIENT_COLUMNS} FROM notice_recipients WHERE id = :id AND notice_id = :noticeId`, { id, noticeId });

export const insertRecipient = (
  recipient: { id: string; noticeId: string; contactName: string; email: string; messageId: string; addedForNotice?: boolean },
  options: InTransaction = {},
) =>
  execute(
    `INSERT INTO notice_recipients (id, notice_id, contact_name, email, message_id, added_for_notice)
     VALUES (:id, :noticeId, :contactName, :email, :messageId, :addedForNotice)`,
    { ...recipient, addedForNotice: recipient.addedForNotice ?? false },
    options,
  );

/** Ids of the copies that finally failed and still have a link. */
export const listFailedRecipientIds = async (noticeId: string, options: InTransaction = {}) =>
  (
    await selectRows<{ id: string }>(
      `SELECT id FROM notice_recipients WHERE notice_id = :noticeId AND status = 'failed' AND revoked_at IS NULL`,
      { noticeId },
      options,
    )
  ).map((r) => r.id);

export const requeueRecipients = (ids: string[], options: InTransaction = {}) =>
  ids.length
    ? execute(`UPDATE notice_recipients SET status = 'queued', attempts = 0, last_error = NULL, updated_at = now() WHERE id IN (:ids)`, { ids }, options)
    : Promise.resolve();

export const listRecipientDeliveries = (noticeId: string, options: InTransaction = {}) =>
  selectRows<Pick<NoticeRecipientRow, 'status' | 'attempts' | 'revokedAt'>>(
    'SELECT status, attempts, revoked_at AS "revokedAt" FROM notice_recipients WHERE notice_id = :noticeId',
    { noticeId },
    options,
  );

export const revokeRecipientLink = (id: string, options: InTransaction = {}) =>
  execute('UPDATE notice_recipients SET revoked_at = now(), updated_at = now() WHERE id = :id', { id }, options);

/** A fresh link token's hash, valid for `days` days from now. */
export const setRecipientToken = (id: string, tokenHash: string, days: number, options: InTransaction = {}) =>
  execute(
    `UPDATE notice_recipients SET token_hash = :hash, token_expires_at = now() + make_interval(days => :days), updated_at = now() WHERE id = :id`,
    { hash: tokenHash, days, id },
    options,
  );

export interface LinkableRecipientRow {
  id: string;
  notice_id: string;
  contact_name: string;
  email: string;
  token_hash: string | null;
  opened_at: Date | null;
  acknowledged_at: Date | null;
}

/** The copy, if its link is neither withdrawn nor expired. */
export const findLinkableRecipient = (id: string) =>
  selectRow<LinkableRecipientRow>(
    `SELECT id, notice_id, contact_name, email, token_hash, opened_at, acknowledged_at FROM notice_recipients
      WHERE id = :id AND revoked_at IS NULL AND token_expires_at > now()`,
    { id },
  );

/** Records the first opening; undefined when the copy was opened before. */
export const markRecipientOpened = async (id: string) =>
  (
    await selectRow<{ opened_at: Date }>(
      `UPDATE notice_recipients SET opened_at = now(), updated_at = now() WHERE id = :id AND opened_at IS NULL RETURNING opened_at`,
      { id },
    )
  )?.opened_at;

export const findRecipientOpenedAt = async (id: string) =>
  (await selectRow<{ opened_at: Date }>('SELECT opened_at FROM notice_recipients WHERE id = :id', { id }))!.opened_at;

/** Records the acknowledgement (and an opening, if none yet); undefined when the copy was acknowledged before. */
export const markRecipientAcknowledged = async (id: string) =>
  (
    await selectRow<{ acknowledged_at: Date }>(
      `UPDATE notice_recipients SET acknowledged_at = now(), opened_at = COALESCE(opened_at, now()), updated_at = now()
      WHERE id = :id AND acknowledged_at IS NULL RETURNING acknowledged_at`,
      { id },
    )
  )?.acknowledged_at;

export const findRecipientAcknowledgedAt = async (id: string) =>
  (await selectRow<{ acknowledged_at: Date }>('SELECT acknowledged_at FROM notice_recipients WHERE id = :id', { id }))!.acknowledged_at;

export interface DeliveryClaim {
  notice_id: string;
  email: string;
  contact_name: string;
  message_id: string;
  attempts: number;
  organisation_id: string;
}

/**
 * Claims a copy for one sending attempt in one statement (not yet accepted, not revoked, not being sent right now
 * unless that claim is `staleMinutes` old) and counts the attempt; undefined when it cannot be claimed.
 */
export const claimRecipientForSending = (id: string, staleMinutes: number) =>
  selectRow<DeliveryClaim>(
    `UPDATE notice_recipients r SET status = 'sending', attempts = attempts + 1, updated_at = now()
       FROM notices n
      WHERE r.id = :id AND n.id = r.notice_id AND r.smtp_accepted_at IS NULL AND r.revoked_at IS NULL
        AND (r.status <> 'sending' OR r.updated_at < now() - make_interval(mins => :stale))
      RETURNING r.notice_id, r.email, r.contact_name, r.message_id, r.attempts, n.organisation_id`,
    { id, stale: staleMinutes },
  );

/** Whether another attempt holds the copy's claim right now. */
export const isRecipientBeingSent = async (id: string) =>
  !!(await selectRow<{ id: string }>(
    `SELECT id FROM notice_recipients WHERE id = :id AND status = 'sending' AND smtp_accepted_at IS NULL AND revoked_at IS NULL`,
    { id },
  ));

export const markRecipientSent = (id: string) =>
  execute(`UPDATE notice_recipients SET status = 'sent', smtp_accepted_at = now(), last_error = NULL, updated_at = now() WHERE id = :id`, { id });

export const markRecipientFailed = (id: string, reason: string) =>
  execute(`UPDATE notice_recipients SET status = 'failed', last_error = :reason, updated_at = now() WHERE id = :id AND smtp_accepted_at IS NULL`, {
    id,
    reason,
  });

/** A copy withdrawn before it went out is failed with that reason; the notice id when that happened now. */
export const failRecipientIfRevoked = async (id: string) =>
  (
    await selectRow<{ notice_id: string }>(
      `UPDATE notice_recipients SET status = 'failed', last_error = 'The link was withdrawn before the message went out.', updated_at = now()
      WHERE id = :id AND revoked_at IS NOT NULL AND smtp_accepted_at IS NULL AND status <> 'failed' RETURNING notice_id`,
      { id },
    )
  )?.notice_id;
