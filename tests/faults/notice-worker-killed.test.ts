// A worker killed with SIGKILL in the middle of a zone-notice e-mail job: pg-boss hands the job out again once
// it expires, another worker finishes it, and each grower contact gets exactly one message in the mail catcher.
//
// The two kill points are the windows deliverNoticeCopy (server/services/notice-mail.ts) promises to cover:
// - during the SMTP DATA phase, before the server accepted the message (our own SMTP server here holds the
//   reply back, so the worker is provably mid-send when it dies): the retry sends the copy, once;
// - after acceptance was recorded, before the job is marked done: the retry finds the copy sent and skips it.
// The one window the service leaves open, as its own comment says: if the process dies after the SMTP server
// accepts and before smtp_accepted_at commits, a later retry sends again, with the same Message-ID, so mail
// systems that de-duplicate by Message-ID still show one message. That window is not asserted here.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';
import { NOTICE_QUEUE, setNoticeRetryPolicy } from '../../server/services/notice-sending.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { messagesTo } from '../helpers/mailbox.ts';
import { acceptProposedZones, addContacts, makeCheckedField, type ScoutedCheck } from '../helpers/zones.ts';
import { killHard, reapChildren, startFixture, until } from './fixtures/child-processes.ts';

/** An SMTP server that reads each message to the end and never answers the DATA phase. */
async function startHoldingSmtp() {
  const received: string[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    onData(stream) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => void simpleParser(Buffer.concat(chunks)).then((mail) => received.push(mail.messageId ?? '')));
    },
  });
  // The killed worker's connection ends mid-session; that is the point, not an error of this test.
  server.on('error', () => {});
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  const { port } = server.server.address() as AddressInfo;
  return { url: `smtp://127.0.0.1:${port}`, received, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}

let org: TestOrganisation;
let adviser: Client;
let scouted: ScoutedCheck;
let zoneSet: Awaited<ReturnType<typeof acceptProposedZones>>;
let holding: Awaited<ReturnType<typeof startHoldingSmtp>>;

beforeAll(async () => {
  org = await makeOrganisation('Notice fault');
  adviser = await signedIn(org.users.adviser.email);
  scouted = await makeCheckedField(org, adviser);
  zoneSet = await acceptProposedZones(adviser, scouted);
  const tag = org.id.slice(0, 8);
  await addContacts(scouted.field.farmId, [
    { name: 'Ada Furrow', email: `ada-${tag}@farm.example` },
    { name: 'Ben Tiller', email: `ben-${tag}@farm.example` },
  ]);
  // Retries a second apart instead of a minute: the jobs are queued by this process, with this policy.
  setNoticeRetryPolicy({ retryDelay: 1 });
  holding = await startHoldingSmtp();
});

afterEach(reapChildren);

afterAll(async () => {
  await reapChildren();
  await holding?.close();
  await stopQueue();
  await closeSimulationPool();
});

const worker = (env: Record<string, string>) => startFixture('notice-worker.ts', { JOB_MAINTENANCE_SECONDS: '1', ...env });

interface CopyRow {
  id: string;
  email: string;
  message_id: string;
  status: string;
  attempts: number;
  smtp_accepted_at: Date | null;
}

const copiesOf = (noticeId: string) =>
  sequelize.query<CopyRow>(
    'SELECT id, email, message_id, status, attempts, smtp_accepted_at FROM notice_recipients WHERE notice_id = :noticeId ORDER BY email',
    {
      replacements: { noticeId },
      type: QueryTypes.SELECT,
    },
  );

async function sentNotice() {
  const draft = await adviser
    .post('/api/notices', { fieldId: scouted.field.id, zoneSetId: zoneSet.id, recommendation: 'Spot-spray both zones this week; leave the rest untreated.' })
    .expect(201);
  await adviser.post(`/api/notices/${draft.body.notice.id}/send`).expect(202);
  return draft.body.notice.id as string;
}

/** The one notice job a worker has taken (state active) for this notice's copies. */
async function activeJob(noticeId: string) {
  const [job] = await sequelize.query<{ id: string; recipient_id: string }>(
    `SELECT j.id, j.data->>'recipientId' AS recipient_id FROM pgboss.job j JOIN notice_recipients r ON r.id::text = j.data->>'recipientId'
      WHERE j.name = :queue AND j.state = 'active' AND r.notice_id = :noticeId`,
    { replacements: { queue: NOTICE_QUEUE, noticeId }, type: QueryTypes.SELECT },
  );
  return job ?? null;
}

/** Kills the worker and makes its job due again: stands in for the 15 minutes after which pg-boss gives up on a silent worker. */
async function killAndExpire(child: ReturnType<typeof worker>, jobId: string) {
  await killHard(child);
  await sequelize.query(`UPDATE pgboss.job SET expire_in = interval '1 second' WHERE id = :jobId`, { replacements: { jobId } });
}

/** Waits for every copy and the notice to settle as sent, and the killed job to complete on its retry. */
async function settled(noticeId: string, jobId: string) {
  const copies = await until('every copy accepted and the notice sent', async () => {
    const rows = await copiesOf(noticeId);
    const [notice] = await sequelize.query<{ status: string }>('SELECT status FROM notices WHERE id = :noticeId', {
      replacements: { noticeId },
      type: QueryTypes.SELECT,
    });
    return notice.status === 'sent' && rows.length === 2 && rows.every((r) => r.status === 'sent') ? rows : null;
  });
  const job = await until('the retried job to complete', async () => {
    const [row] = await sequelize.query<{ state: string; retry_count: number }>('SELECT state, retry_count FROM pgboss.job WHERE id = :jobId', {
      replacements: { jobId },
      type: QueryTypes.SELECT,
    });
    return row?.state === 'completed' ? row : null;
  });
  expect(job.retry_count).toBeGreaterThanOrEqual(1);
  return copies;
}

/** Exactly one message per copy in the mail catcher, found by the Message-ID fixed at queue time. */
async function expectOneMessageEach(copies: CopyRow[]) {
  for (const copy of copies) {
    expect(copy.smtp_accepted_at).not.toBeNull();
    const mine = (await messagesTo(copy.email)).filter((m) => m.messageId === copy.message_id);
    expect(mine, copy.email).toHaveLength(1);
  }
}

describe('a notice worker killed mid-job', () => {
  it('killed while the SMTP server holds the DATA phase open: the retry sends that copy once', async () => {
    const noticeId = await sentNotice();
    const first = worker({ SMTP_URL: holding.url });
    const job = await until('the first worker to be mid-send', () => activeJob(noticeId));
    const [inFlight] = (await copiesOf(noticeId)).filter((c) => c.id === job.recipient_id);
    // The whole message reached the holding server, which never answered: the worker is waiting for acceptance.
    await until('the message to reach the holding server', () => holding.received.includes(inFlight.message_id));
    await killAndExpire(first, job.id);
    const [claim] = await copiesOf(noticeId).then((rows) => rows.filter((c) => c.id === inFlight.id));
    expect(claim).toMatchObject({ status: 'sending', attempts: 1, smtp_accepted_at: null });
    // Stands in for the 15 minutes after which a 'sending' mark counts as a dead attempt (STALE_SENDING_MINUTES in
    // notice-mail.ts). In production the job's own 15-minute expiry plus at least a minute of back-off passes it.
    await sequelize.query(`UPDATE notice_recipients SET updated_at = now() - interval '1 hour' WHERE id = :id`, { replacements: { id: inFlight.id } });

    worker({});
    const copies = await settled(noticeId, job.id);
    await expectOneMessageEach(copies);
    expect(copies.find((c) => c.id === inFlight.id)?.attempts).toBe(2);
    expect(holding.received.filter((id) => id === inFlight.message_id)).toHaveLength(1);
  });

  it('killed after SMTP acceptance was recorded, before the job was marked done: the retry sends nothing more', async () => {
    const noticeId = await sentNotice();
    const marker = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'patchwise-fault-')), 'job');
    const first = worker({ FAULT_HANG: 'after-send', FAULT_MARKER: marker });
    const jobId = await until('the first worker to send its copy', () => fs.existsSync(marker) && fs.readFileSync(marker, 'utf8'));
    const job = await activeJob(noticeId);
    expect(job?.id).toBe(jobId);
    await killAndExpire(first, jobId);

    worker({});
    const copies = await settled(noticeId, jobId);
    await expectOneMessageEach(copies);
    // The retry found smtp_accepted_at set and did not even count an attempt.
    expect(copies.find((c) => c.id === job!.recipient_id)?.attempts).toBe(1);
  });
});
