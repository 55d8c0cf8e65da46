// Which organisation a message is sent for, carried in a header the local mail catcher files it by. Added only
// while the development mailbox is served: real recipients have no use for an internal id.
import { config } from '../config.ts';

export const ORGANISATION_HEADER = 'X-Patchwise-Organisation';

export function organisationHeader(organisationId: string): Record<string, string> {
  return config.mailboxServed ? { [ORGANISATION_HEADER]: organisationId } : {};
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The organisation id in a raw message's header block, or null when it has none (or not an id). */
export function organisationOfRawMessage(raw: Buffer): string | null {
  const text = raw.subarray(0, 65_536).toString('utf8');
  const headerEnd = text.search(/\r?\n\r?\n/);
  const headers = headerEnd === -1 ? text : text.slice(0, headerEnd);
  const value = new RegExp(`^${ORGANISATION_HEADER}:[ \\t]*(\\S+)`, 'im').exec(headers)?.[1] ?? null;
  return value && UUID.test(value) ? value.toLowerCase() : null;
}
