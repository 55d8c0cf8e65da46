import { simpleParser } from 'mailparser';
import { notFound } from '../errors.ts';
import type { Actor } from '../auth/passport.ts';
import { hideLinksOfOthers } from './mailbox-redaction.ts';
import { findMessageOfOrganisation, listMessagesOfOrganisation } from '../queries/mailbox-messages.ts';

export async function listMessages(viewer: Actor, limit = 200) {
  const rows = await listMessagesOfOrganisation(viewer.organisationId, limit);
  return rows.map((r) => ({ id: Number(r.id), from: r.envelope_from, to: r.envelope_to, subject: r.subject, receivedAt: r.received_at }));
}

async function loadRaw(viewer: Actor, id: number) {
  const row = await findMessageOfOrganisation(viewer.organisationId, id);
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
