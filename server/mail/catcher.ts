// The local mail catcher: an SMTP server on loopback that keeps every message in the database,
// where the admin's mailbox page reads it (filed by the organisation the app sent it for). It never relays anything onward.
import { SMTPServer } from 'smtp-server';
import pg from 'pg';
import { organisationOfRawMessage } from './organisation-header.ts';
import { logger } from '../logger.ts';

export interface MailCatcher {
  port: number;
  close(): Promise<void>;
}

export async function startMailCatcher(options: { port: number; databaseUrl: string; host?: string }): Promise<MailCatcher> {
  const pool = new pg.Pool({ connectionString: options.databaseUrl, max: 2 });
  // An idle connection dropped by a database restart must not bring the catcher (and `npm test`) down; the next message reconnects.
  pool.on('error', (error) => logger.error({ err: error }, 'mail catcher database connection lost'));
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Patchwise local mail catcher',
    size: 25 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', async () => {
        const raw = Buffer.concat(chunks);
        const subject = /^Subject: (.*)$/im.exec(raw.subarray(0, 16_384).toString('utf8'))?.[1] ?? null;
        try {
          await pool.query('INSERT INTO mailbox_messages (envelope_from, envelope_to, subject, raw, organisation_id) VALUES ($1, $2, $3, $4, $5)', [
            session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
            session.envelope.rcptTo.map((r) => r.address),
            subject,
            raw,
            organisationOfRawMessage(raw),
          ]);
          callback();
        } catch (error) {
          callback(error as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, options.host ?? '127.0.0.1', () => resolve());
  });
  return {
    port: options.port,
    close: async () => {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await pool.end();
    },
  };
}
