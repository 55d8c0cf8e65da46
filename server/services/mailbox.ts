import { simpleParser } from 'mailparser';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import { notFound } from '../errors.ts';
import type { Actor } from '../auth/passport.ts';
import { hideLinksOfOthers } from './mailbox-redaction.ts';

interface StoredMessage {
  id: number;
  envelope_from: string | null;
  envelope_to: string[];
  subject: string | null;
  raw: Buffer;
  received_at: Date;
}

// One deployment serves many organisations: an admin reads only the mail the app sent for their own organisation
// (filed by the catcher from the app's header), so no recipient address, a farm contact's included, can pull
// another organisation's mail into view.
const SENT_FOR_ORGANISATION = 'organisation_id = :organisationId';

export async function listMessages(viewer: Actor, limit = 200) {
  const rows = await sequelize.query<Omit<StoredMessage, 'raw'>>(
    `SELECT id, envelope_from, envelope_to, subject, received_at FROM mailbox_messages WHERE ${SENT_FOR_ORGANISATION} ORDER BY id DESC LIMIT :limit`,
    { replacements: { limit, organisationId: viewer.organisationId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ id: Number(r.id), from: r.envelope_from, to: r.envelope_to, subject: r.subject, receivedAt: r.received_at }));
}

async function loadRaw(viewer: Actor, id: number) {
  const [row] = await sequelize.query<StoredMessage>(`SELECT * FROM mailbox_messages WHERE id = :id AND ${SENT_FOR_ORGANISATION}`, {
    replacements: { id, organisationId: viewer.organisationId },
    type: QueryTypes.SELECT,
  });
  if (!row) throw notFound('That message');
  return row;
}

/** A message as its recipients see it, except that links meant for someone other than the viewer are hidden. */
export async function getMessage(viewer: Actor, id: number) {
  const row = await loadRaw(viewer, id);
  const parsed = await simpleParser(row.raw);
  const hide = (body: string) => hideLinksOfOthers(body, row.envelope_to, viewer.email);
  return {
    id: Number(row.id),
    from: parsed.from?.text ?? row.envelope_from,
    to: row.envelope_to,
    subject: parsed.subject ?? row.subject,
    receivedAt: row.received_at,
    text: hide(parsed.text ?? ''),
    html: typeof parsed.html === 'string' ? hide(parsed.html) : null,
    attachments: parsed.attachments.map((a, index) => ({ index, filename: a.filename ?? `attachment-${index}`, contentType: a.contentType, size: a.size })),
  };
}

export async function getAttachment(viewer: Actor, id: number, index: number) {
  const row = await loadRaw(viewer, id);
  const parsed = await simpleParser(row.raw);
  const attachment = parsed.attachments[index];
  if (!attachment) throw notFound('That attachment');
  // Text attachments could carry a link as well; images and binary files are passed on as they are.
  const content = /^text\/|json|xml/.test(attachment.contentType)
    ? Buffer.from(hideLinksOfOthers(attachment.content.toString('utf8'), row.envelope_to, viewer.email))
    : attachment.content;
  return { filename: attachment.filename ?? `attachment-${index}`, contentType: attachment.contentType, content };
}
