import { selectRow, selectRows } from './sql.ts';

export interface StoredMessage {
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

export const listMessagesOfOrganisation = (organisationId: string, limit: number) =>
  selectRows<Omit<StoredMessage, 'raw'>>(
    `SELECT id, envelope_from, envelope_to, subject, received_at FROM mailbox_messages WHERE ${SENT_FOR_ORGANISATION} ORDER BY id DESC LIMIT :limit`,
    { limit, organisationId },
  );

export const findMessageOfOrganisation = (organisationId: string, id: number) =>
  selectRow<StoredMessage>(`SELECT * FROM mailbox_messages WHERE id = :id AND ${SENT_FOR_ORGANISATION}`, { id, organisationId });
