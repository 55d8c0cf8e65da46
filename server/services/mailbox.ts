import { simpleParser } from 'mailparser';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import { notFound } from '../errors.ts';

interface StoredMessage {
  id: number;
  envelope_from: string | null;
  envelope_to: string[];
  subject: string | null;
  raw: Buffer;
  received_at: Date;
}

// One deployment serves many organisations: an admin reads only mail sent to their own people
// (users and farm contacts), never another organisation's invitation links or notices.
const ADDRESSED_TO_ORGANISATION = `EXISTS (
  SELECT 1 FROM unnest(envelope_to) AS recipient
  WHERE lower(recipient) IN (
    SELECT email FROM users WHERE organisation_id = :organisationId
    UNION SELECT c.email FROM farm_contacts c JOIN farms f ON f.id = c.farm_id WHERE f.organisation_id = :organisationId
  )
)`;

export async function listMessages(organisationId: string, limit = 200) {
  const rows = await sequelize.query<Omit<StoredMessage, 'raw'>>(
    `SELECT id, envelope_from, envelope_to, subject, received_at FROM mailbox_messages WHERE ${ADDRESSED_TO_ORGANISATION} ORDER BY id DESC LIMIT :limit`,
    { replacements: { limit, organisationId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ id: Number(r.id), from: r.envelope_from, to: r.envelope_to, subject: r.subject, receivedAt: r.received_at }));
}

async function loadRaw(organisationId: string, id: number) {
  const [row] = await sequelize.query<StoredMessage>(`SELECT * FROM mailbox_messages WHERE id = :id AND ${ADDRESSED_TO_ORGANISATION}`, {
    replacements: { id, organisationId },
    type: QueryTypes.SELECT,
  });
  if (!row) throw notFound('That message');
  return row;
}

export async function getMessage(organisationId: string, id: number) {
  const row = await loadRaw(organisationId, id);
  const parsed = await simpleParser(row.raw);
  return {
    id: Number(row.id),
    from: parsed.from?.text ?? row.envelope_from,
    to: row.envelope_to,
    subject: parsed.subject ?? row.subject,
    receivedAt: row.received_at,
    text: parsed.text ?? '',
    html: typeof parsed.html === 'string' ? parsed.html : null,
    attachments: parsed.attachments.map((a, index) => ({ index, filename: a.filename ?? `attachment-${index}`, contentType: a.contentType, size: a.size })),
  };
}

export async function getAttachment(organisationId: string, id: number, index: number) {
  const parsed = await simpleParser((await loadRaw(organisationId, id)).raw);
  const attachment = parsed.attachments[index];
  if (!attachment) throw notFound('That attachment');
  return { filename: attachment.filename ?? `attachment-${index}`, contentType: attachment.contentType, content: attachment.content };
}
