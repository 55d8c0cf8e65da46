// Reads what the local mail catcher received, straight from its table, parsed with mailparser.
import { simpleParser, type ParsedMail } from 'mailparser';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';

export async function messagesTo(address: string): Promise<ParsedMail[]> {
  const rows = await sequelize.query<{ raw: Buffer }>('SELECT raw FROM mailbox_messages WHERE :address = ANY(envelope_to) ORDER BY id', {
    replacements: { address },
    type: QueryTypes.SELECT,
  });
  return Promise.all(rows.map((r) => simpleParser(r.raw)));
}

/** Waits for the n-th message to an address (mail goes out after the API has answered). */
export async function waitForMessage(address: string, count = 1, timeoutMs = 10_000): Promise<ParsedMail[]> {
  const started = Date.now();
  for (;;) {
    const messages = await messagesTo(address);
    if (messages.length >= count) return messages;
    if (Date.now() - started > timeoutMs) throw new Error(`no message #${count} for ${address} within ${timeoutMs} ms (got ${messages.length})`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

export function linkToken(message: ParsedMail): string {
  const match = /token=([A-Za-z0-9_-]+)/.exec(message.text ?? '');
  if (!match) throw new Error('no token link in the message');
  return match[1];
}

/** The token of a zone notice link (`/n/<recipient id>.<random>`). */
export function noticeLinkToken(message: ParsedMail): string {
  const match = /\/n\/([0-9a-f-]{36}\.[A-Za-z0-9_-]{43})/.exec(message.text ?? '');
  if (!match) throw new Error('no notice link in the message');
  return match[1];
}
