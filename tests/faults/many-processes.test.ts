// Two web processes behind a loopback balancer and two worker processes, all on one PostgreSQL, each started from
// the real entries (server/index.ts with WORKERS=none, server/worker.ts). Checks and a zone notice go through both
// web processes, a batch of photos is uploaded, and one web and one worker process are killed with SIGKILL mid-batch.
// The client retries what it would retry (the same photos under the same client ids), and nothing is lost or doubled:
// one sighting per client id, one thumbnail per photo, one stored check per set of inputs, one e-mail per recipient.
import crypto from 'node:crypto';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { removeOrphanFiles } from '../../server/services/orphan-cleanup.ts';
import { photoFilePart } from '../../shared/schemas/sightings.ts';
import { freePort } from '../../scripts/lib/free-port.ts';
import { startBehindBalancer, type Balancer } from '../../scripts/lib/web-balancer.ts';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation } from '../helpers/org.ts';
import { messagesTo } from '../helpers/mailbox.ts';
import { insideField, makeJpeg, scoutingSetUp, uploadedFiles } from '../helpers/photos.ts';
import { acceptProposedZones, addContacts, makeCheckedField } from '../helpers/zones.ts';
import { hasExited, killHard, reapChildren, startModule, until } from './fixtures/child-processes.ts';
import { signInBalanced, withClientRetries, type Answer } from './fixtures/connection-per-request.ts';

const PHOTOS = 12;
const PER_REQUEST = 2;
const QUEUES = ['photo-thumbnail', 'pattern-check', 'notice-copy'];

let balancer: Balancer | null = null;

afterAll(async () => {
  await balancer?.close();
  await reapChildren();
  await stopQueue();
});

async function startWeb() {
  const port = await freePort();
  const child = startModule('server/index.ts', { WORKERS: 'none', PORT: String(port) });
  await until('a web process to be ready', () =>
    fetch(`http://127.0.0.1:${port}/readyz`).then(
      (r) => r.ok,
      () => false,
    ),
  );
  return { port, child };
}

const startWorker = () => startModule('server/worker.ts', { WORKERS: 'only', JOB_MAINTENANCE_SECONDS: '1' });

/** One upload request's multipart body, encoded by the platform's FormData as the scout's screen sends it. */
async function uploadBody(photos: Buffer[], clientIds: string[], fields: Record<string, string>) {
  const form = new FormData();
  for (const [key, value] of Object.entries(fields)) form.append(key, value);
  form.append('clientIds', JSON.stringify(clientIds));
  photos.forEach((bytes, i) => form.append(photoFilePart, new Blob([new Uint8Array(bytes)], { type: 'image/jpeg' }), `${clientIds[i]}.jpg`));
  const encoded = new Request('http://127.0.0.1/', { method: 'POST', body: form });
  return { bytes: Buffer.from(await encoded.arrayBuffer()), contentType: encoded.headers.get('content-type')! };
}

/** Stands in for the minutes pg-boss waits before it gives up on a silent worker, and for the retry back-off. */
async function hurryJobs() {
  await sequelize.query(`UPDATE pgboss.job SET expire_in = interval '1 second' WHERE name IN (:queues) AND state = 'active'`, {
    replacements: { queues: QUEUES },
  });
  await sequelize.query(`UPDATE pgboss.job SET start_after = now() WHERE name IN (:queues) AND state = 'retry'`, { replacements: { queues: QUEUES } });
}

const one = <T extends object>(sql: string, replacements: Record<string, unknown>) => sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });

describe('many web and worker processes on one database', () => {
  it('loses and doubles nothing when a web and a worker process are killed mid-batch', async () => {
    // What the test starts from, made in this process: a scouted field with a check and accepted zones, grower
    // contacts, and a second organisation's field for the photos.
    const noticeOrg = await makeOrganisation('Many processes');
    const scouted = await makeCheckedField(noticeOrg, await signedIn(noticeOrg.users.adviser.email));
    const zoneSet = await acceptProposedZones(await signedIn(noticeOrg.users.adviser.email), scouted);
    const tag = noticeOrg.id.slice(0, 8);
    const recipients = ['ada', 'ben', 'cai', 'dot'].map((name) => ({ name: `Grower ${name}`, email: `${name}-${tag}@farm.example` }));
    await addContacts(scouted.field.farmId, recipients);
    const upload = await scoutingSetUp();
    const photos = await Promise.all(
      Array.from({ length: PHOTOS }, (_, i) =>
        makeJpeg({ width: 800, height: 600, markSeed: 4000 + i, gps: insideField(0.08 + 0.07 * i, 0.4 + 0.02 * i), dateTimeOriginal: '2026:03:12 10:00:00' }),
      ),
    );
    const clientIds = photos.map(() => crypto.randomUUID());

    const started = await startBehindBalancer(2, () => startWeb());
    balancer = started.balancer;
    const [webA, webB] = started.processes;
    const [workerA, workerB] = [startWorker(), startWorker()];
    // The survivors must stay up on their own: a process that dies unasked fails the test at once.
    const survivorsUp = () => {
      if (hasExited(webB.child) || hasExited(workerB)) throw new Error('a web or worker process that was not killed has exited');
    };
    const adviser = await signInBalanced(balancer.baseUrl, noticeOrg.users.adviser.email);
    const scout = await signInBalanced(balancer.baseUrl, upload.org.users.scout.email);

    // Checks through both web processes: each asked twice at once, a quick one (run in the web process) and one
    // large enough for the queue (run by a worker).
    const checkRequests = [99, 2999].flatMap((simulations) =>
      [0, 1].map(() =>
        adviser.request('POST', '/api/checks', { json: { fieldId: scouted.field.id, pestId: scouted.pest.id, options: { simulations, seed: 7 } } }),
      ),
    );
    const checkAnswers = await Promise.all(checkRequests);
    for (const answer of checkAnswers) expect([200, 201, 202], JSON.stringify(answer.body).slice(0, 200)).toContain(answer.status);
    const checkIds = checkAnswers.map((a) => (a.body as { check: { id: string } }).check.id);
    expect(checkIds[0]).toBe(checkIds[1]);
    expect(checkIds[2]).toBe(checkIds[3]);

    // The notice: drafted through one connection, sent through another; the workers deliver its copies.
    const draft = await adviser.request('POST', '/api/notices', {
      json: { fieldId: scouted.field.id, zoneSetId: zoneSet.id, recommendation: 'Spot-treat both zones; leave the rest of the field untreated.' },
    });
    expect(draft.status).toBe(201);
    const noticeId = (draft.body as { notice: { id: string } }).notice.id;
    const sent = await withClientRetries(() => adviser.request('POST', `/api/notices/${noticeId}/send`));
    expect(sent.status).toBe(202);

    // The batch, in requests of two photos, three at a time.
    const requests = Array.from({ length: PHOTOS / PER_REQUEST }, (_, r) => r * PER_REQUEST);
    const fields = { pestId: upload.pest.id, fieldId: upload.field.id };
    const answers = new Map<number, Answer & { tries: number }>();
    const lanes = [0, 1, 2].map(async (lane) => {
      for (const first of requests.filter((_, r) => r % 3 === lane)) {
        const body = await uploadBody(photos.slice(first, first + PER_REQUEST), clientIds.slice(first, first + PER_REQUEST), fields);
        answers.set(first, await withClientRetries(() => scout.request('POST', '/api/photos', body)));
      }
    });
    await until('the first upload answers', () => answers.size >= 2);
    await killHard(webA.child);
    await until('the first thumbnail', async () => {
      const [row] = await one<{ ready: number }>(`SELECT count(*)::int AS ready FROM photos WHERE organisation_id = :org AND thumbnail_status = 'ready'`, {
        org: upload.org.id,
      });
      return row.ready >= 1;
    });
    await killHard(workerA);
    await Promise.all(lanes);
    survivorsUp();

    // Every photo's outcome, by its client id: placed the first time, or a duplicate of the one sighting when a
    // retried request had already been stored before its connection was cut.
    const outcomes = new Map<string, string>();
    for (const answer of answers.values()) {
      expect(answer.status, JSON.stringify(answer.body).slice(0, 300)).toBe(200);
      for (const result of (answer.body as { results: Array<{ clientId: string; outcome: string }> }).results) outcomes.set(result.clientId, result.outcome);
    }
    expect([...outcomes.keys()].sort()).toEqual([...clientIds].sort());
    for (const id of clientIds) expect(['placed', 'duplicate'], id).toContain(outcomes.get(id));
    const sha = (bytes: Buffer) => crypto.createHash('sha256').update(bytes).digest('hex');
    const perPhoto = await one<{ sha: string; sightings: number }>(
      `SELECT photo_sha256 AS sha, count(*)::int AS sightings FROM sightings WHERE field_id = :fieldId AND deleted_at IS NULL GROUP BY photo_sha256`,
      { fieldId: upload.field.id },
    );
    expect(new Map(perPhoto.map((r) => [r.sha, r.sightings]))).toEqual(new Map(photos.map((p) => [sha(p), 1])));

    // The killed worker's jobs come back once they expire; the survivor finishes them and the rest.
    let lastSeen = '';
    const stored = await until(
      'every thumbnail, both checks and every copy settled',
      async () => {
        survivorsUp();
        const thumbnails = await one<{ status: string; storage_key: string; thumbnail_key: string | null }>(
          'SELECT thumbnail_status AS status, storage_key, thumbnail_key FROM photos WHERE organisation_id = :org',
          { org: upload.org.id },
        );
        const checks = await one<{ status: string }>('SELECT status FROM pattern_checks WHERE field_id = :fieldId AND id <> :setUpCheck', {
          fieldId: scouted.field.id,
          setUpCheck: scouted.checkId,
        });
        // A copy still marked 'sending' with no SMTP acceptance and no job at work on it was the killed worker's: its
        // mark is aged past the 15 minutes after which deliverNoticeCopy counts it a dead attempt, before the retries are
        // hurried, so hurried retries never spend their budget against a mark only time would clear.
        await sequelize.query(
          `UPDATE notice_recipients r SET updated_at = now() - interval '1 hour'
          WHERE r.notice_id = :noticeId AND r.status = 'sending' AND r.smtp_accepted_at IS NULL
            AND NOT EXISTS (SELECT 1 FROM pgboss.job j WHERE j.name = 'notice-copy' AND j.state = 'active' AND j.data->>'recipientId' = r.id::text)`,
          { replacements: { noticeId } },
        );
        await hurryJobs();
        const [notice] = await one<{ status: string }>('SELECT status FROM notices WHERE id = :noticeId', { noticeId });
        const copyStates = await one<{ status: string }>('SELECT status FROM notice_recipients WHERE notice_id = :noticeId', { noticeId });
        const jobs = await one<{ name: string; state: string; n: number }>(
          'SELECT name, state, count(*)::int AS n FROM pgboss.job WHERE name IN (:queues) GROUP BY name, state',
          { queues: QUEUES },
        );
        lastSeen = JSON.stringify({ thumbnails: thumbnails.map((t) => t.status), checks, notice, copyStates, jobs });
        const settled =
          thumbnails.length === PHOTOS && thumbnails.every((t) => t.status === 'ready') && checks.every((c) => c.status === 'done') && notice.status === 'sent';
        return settled ? { thumbnails, checks } : null;
      },
      120_000,
    ).catch((error: Error) => {
      throw new Error(`${error.message}; last seen ${lastSeen}`);
    });

    // One thumbnail file per photo, beside its original, and nothing else of this organisation's in storage once the
    // hourly housekeeping has run (now, without its 15-minute grace): a photo cut off between its file and its row
    // leaves only a file no row names.
    await removeOrphanFiles({ graceMs: 0 });
    const files = uploadedFiles()
      .map((f) => f.split(path.sep).join('/'))
      .filter((f) => f.startsWith(`${upload.org.id}/`));
    expect(files.sort()).toEqual(stored.thumbnails.flatMap((t) => [t.storage_key, t.thumbnail_key!]).sort());
    // One stored check per set of inputs, however many processes were asked and whichever died.
    expect(stored.checks).toHaveLength(2);
    // One e-mail per recipient at the mail catcher, carrying the Message-ID fixed when the copy was queued. The one
    // window deliverNoticeCopy leaves (server/services/notice-mail.ts): a worker killed after the SMTP server accepted
    // a copy and before that was recorded. A random kill can land there; then the retry sends the same message again,
    // with the same Message-ID, so a mail system that de-duplicates by Message-ID shows one. A second copy is allowed
    // only with that Message-ID and only after a retried attempt; never a third, never another Message-ID.
    const copies = await one<{ email: string; message_id: string; attempts: number }>(
      'SELECT email, message_id, attempts FROM notice_recipients WHERE notice_id = :noticeId',
      { noticeId },
    );
    expect(copies.map((c) => c.email).sort()).toEqual(recipients.map((r) => r.email).sort());
    for (const copy of copies) {
      const received = (await messagesTo(copy.email)).map((m) => m.messageId);
      expect(new Set(received), copy.email).toEqual(new Set([copy.message_id]));
      expect(received.length, copy.email).toBeLessThanOrEqual(copy.attempts > 1 ? 2 : 1);
    }
    // Both web processes took connections before the kill.
    expect(balancer.connections().every((n) => n > 0)).toBe(true);
  }, 420_000);
});
