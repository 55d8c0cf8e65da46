// The server process killed with SIGKILL during an upload batch, then started again: every photo of the batch is
// either a complete sighting (photo row, sighting row, and a file whose SHA-256 matches the row) or absent with
// nothing left of it, and sending the same batch again places the absent ones and gives the stored ones as
// duplicates, so each photo ends as exactly one sighting. Two kill points, both made deterministic:
// - while the request body is still arriving (a third of it sent): nothing may be stored;
// - in the middle of the batch: the third photo's file is on disk and its transaction is waiting on a row lock
//   this test holds (an uncommitted sighting with the same photo hash), so the first two photos are committed,
//   the third is half-written and the rest untouched when the process dies.
import crypto from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { config } from '../../server/config.ts';
import { removeOrphanFiles } from '../../server/services/orphan-cleanup.ts';
import { TEMP_PREFIX } from '../../server/services/storage.ts';
import { photoFilePart } from '../../shared/schemas/sightings.ts';
import { freePort } from '../../scripts/lib/free-port.ts';
import { TEST_PASSWORD } from '../helpers/org.ts';
import { insideField, makeJpeg, scoutingSetUp, uploadedFiles, type ScoutingSetUp } from '../helpers/photos.ts';
import { killHard, reapChildren, startFixture, until } from './fixtures/child-processes.ts';

const BATCH_SIZE = 6;
let port: number;
let base: string;

beforeAll(async () => {
  port = await freePort();
  base = `http://127.0.0.1:${port}`;
});

afterEach(reapChildren);
afterAll(reapChildren);

async function startApp() {
  const child = startFixture('server.ts', { WORKERS: 'off', FAULT_PORT: String(port) });
  await until('the app to answer', () =>
    fetch(`${base}/api/auth/csrf`).then(
      (r) => r.ok,
      () => false,
    ),
  );
  return child;
}

interface Session {
  cookie: string;
  csrf: string;
}

const cookiesOf = (res: Response) =>
  res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');

/** Signs in to the child process over HTTP; the session is kept in PostgreSQL, so it outlives a restart. */
async function signInOverHttp(email: string): Promise<Session> {
  const csrfRes = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', cookie: cookiesOf(csrfRes), 'x-csrf-token': csrfToken },
    body: JSON.stringify({ email, password: TEST_PASSWORD }),
  });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${await res.text()}`);
  return { cookie: cookiesOf(res), csrf: ((await res.json()) as { csrfToken: string }).csrfToken };
}

/** The multipart body the scout's screen sends, encoded by the platform's own FormData (fields first, then photos). */
async function batchBody(photos: Buffer[], fields: Record<string, string>) {
  const form = new FormData();
  for (const [key, value] of Object.entries(fields)) form.append(key, value);
  photos.forEach((bytes, i) => form.append(photoFilePart, new Blob([new Uint8Array(bytes)], { type: 'image/jpeg' }), `batch-${i}.jpg`));
  const encoded = new Request(base, { method: 'POST', body: form });
  return { bytes: Buffer.from(await encoded.arrayBuffer()), contentType: encoded.headers.get('content-type')! };
}

type Batch = Awaited<ReturnType<typeof batchBody>>;

/** Starts POST /api/photos with the whole Content-Length declared but only `sendBytes` of the body written. */
function startUpload(session: Session, batch: Batch, sendBytes = batch.bytes.length) {
  const req = http.request(`${base}/api/photos`, {
    method: 'POST',
    headers: { 'content-type': batch.contentType, 'content-length': batch.bytes.length, cookie: session.cookie, 'x-csrf-token': session.csrf },
  });
  const answered = new Promise<number>((resolve, reject) => {
    req.on('response', (res) => {
      res.resume();
      res.on('end', () => resolve(res.statusCode ?? 0));
    });
    req.on('error', reject);
  });
  // The kill makes it fail; the test awaits that, and a rejection seen before then is not an unhandled one.
  answered.catch(() => {});
  const written = new Promise<void>((resolve) => req.write(batch.bytes.subarray(0, sendBytes), () => resolve()));
  if (sendBytes === batch.bytes.length) req.end();
  return { answered, written };
}

async function sendBatch(session: Session, batch: Batch) {
  const res = await fetch(`${base}/api/photos`, {
    method: 'POST',
    headers: { 'content-type': batch.contentType, cookie: session.cookie, 'x-csrf-token': session.csrf },
    body: batch.bytes,
  });
  expect(res.status).toBe(200);
  return ((await res.json()) as { results: Array<{ outcome: string; sightingId?: string; photoId?: string }> }).results;
}

const sha256 = (bytes: Uint8Array) => crypto.createHash('sha256').update(bytes).digest('hex');

interface StoredPhoto {
  id: string;
  sha256: string;
  storage_key: string;
  thumbnail_key: string | null;
  sightings: number;
}

const storedPhotos = (organisationId: string) =>
  sequelize.query<StoredPhoto>(
    `SELECT p.id, p.sha256, p.storage_key, p.thumbnail_key, (SELECT count(*)::int FROM sightings s WHERE s.photo_id = p.id AND s.deleted_at IS NULL) AS sightings
       FROM photos p WHERE p.organisation_id = :org`,
    { replacements: { org: organisationId }, type: QueryTypes.SELECT },
  );

const filesOf = (organisationId: string) =>
  uploadedFiles()
    .map((f) => f.split(path.sep).join('/'))
    .filter((f) => f.startsWith(`${organisationId}/`));

/** Nothing half-written: each photo row has one sighting and its whole file, each file has its row, no temp file anywhere. */
async function expectWholeOrAbsent(organisationId: string) {
  const photos = await storedPhotos(organisationId);
  for (const photo of photos) {
    expect(photo.sightings, photo.storage_key).toBe(1);
    expect(sha256(fs.readFileSync(path.join(config.uploadDir, ...photo.storage_key.split('/')))), photo.storage_key).toBe(photo.sha256);
  }
  const named = photos.flatMap((p) => [p.storage_key, ...(p.thumbnail_key ? [p.thumbnail_key] : [])]);
  expect(filesOf(organisationId).sort()).toEqual(named.sort());
  expect(uploadedFiles().filter((f) => path.basename(f).startsWith(TEMP_PREFIX))).toEqual([]);
  return photos;
}

async function makeBatch(setUp: ScoutingSetUp) {
  const photos = await Promise.all(
    Array.from({ length: BATCH_SIZE }, (_, i) =>
      makeJpeg({
        width: 640,
        height: 480,
        markSeed: 1000 + i,
        gps: insideField(0.15 + 0.14 * i, 0.5),
        dateTimeOriginal: '2026:03:10 10:00:00',
        offsetTimeOriginal: '-03:00',
      }),
    ),
  );
  return { photos, batch: await batchBody(photos, { pestId: setUp.pest.id, fieldId: setUp.field.id }) };
}

/** Restart, the start-up orphan clean-up (a worker process runs it in production; WORKERS=off here), then the checks and a re-send. */
async function restartAndResend(setUp: ScoutingSetUp, session: Session, photos: Buffer[], batch: Batch) {
  await startApp();
  const { removed } = await removeOrphanFiles({ graceMs: 0 });
  const before = await expectWholeOrAbsent(setUp.org.id);
  const storedBefore = new Map(before.map((p) => [p.sha256, p.id]));

  const results = await sendBatch(session, batch);
  expect(results).toHaveLength(BATCH_SIZE);
  photos.forEach((bytes, i) => {
    const earlier = storedBefore.get(sha256(bytes));
    if (earlier) expect(results[i]).toMatchObject({ outcome: 'duplicate', photoId: earlier });
    else expect(results[i].outcome, `photo ${i}`).toBe('placed');
  });

  const after = await expectWholeOrAbsent(setUp.org.id);
  expect(after.map((p) => p.sha256).sort()).toEqual(photos.map(sha256).sort());
  const [{ sightings }] = await sequelize.query<{ sightings: number }>(
    'SELECT count(*)::int AS sightings FROM sightings WHERE field_id = :fieldId AND deleted_at IS NULL',
    {
      replacements: { fieldId: setUp.field.id },
      type: QueryTypes.SELECT,
    },
  );
  expect(sightings).toBe(BATCH_SIZE);
  return {
    removed: removed.map((f) => path.relative(config.uploadDir, f).split(path.sep).join('/')).filter((f) => f.startsWith(`${setUp.org.id}/`)),
    storedBefore,
  };
}

describe('the server killed during an upload batch', () => {
  it('killed while the body is still arriving: nothing is stored, and the re-sent batch places every photo', async () => {
    const setUp = await scoutingSetUp();
    const { photos, batch } = await makeBatch(setUp);
    const server = await startApp();
    const session = await signInOverHttp(setUp.org.users.scout.email);

    const upload = startUpload(session, batch, Math.floor(batch.bytes.length / 3));
    await upload.written;
    await killHard(server);
    await expect(upload.answered).rejects.toThrow();

    const { removed, storedBefore } = await restartAndResend(setUp, session, photos, batch);
    expect(storedBefore.size).toBe(0);
    expect(removed).toEqual([]);
  });

  it('killed with two photos committed and the third half-written: the third is cleaned up and re-sent, the first two stay single', async () => {
    const setUp = await scoutingSetUp();
    const { photos, batch } = await makeBatch(setUp);
    const server = await startApp();
    const session = await signInOverHttp(setUp.org.users.scout.email);
    const heldSha = sha256(photos[2]);

    // An uncommitted sighting with the third photo's hash in the same field: the server's insert of that
    // sighting waits on the unique index (one sighting per photo per field) until this transaction ends.
    const hold: Transaction = await sequelize.transaction();
    try {
      const [walk] = await sequelize.query<{ id: string }>(
        `INSERT INTO walks (organisation_id, field_id, scout_id, walked_on) VALUES (:org, :fieldId, :scout, '2000-01-01') RETURNING id`,
        { replacements: { org: setUp.org.id, fieldId: setUp.field.id, scout: setUp.org.users.scout.id }, type: QueryTypes.SELECT, transaction: hold },
      );
      await sequelize.query(
        `INSERT INTO sightings (organisation_id, field_id, walk_id, pest_id, photo_sha256, position_source, status, created_by)
         VALUES (:org, :fieldId, :walkId, :pestId, :sha, 'pin', 'needs-pin', :scout)`,
        {
          replacements: { org: setUp.org.id, fieldId: setUp.field.id, walkId: walk.id, pestId: setUp.pest.id, sha: heldSha, scout: setUp.org.users.scout.id },
          transaction: hold,
        },
      );

      const upload = startUpload(session, batch);
      await until('the third photo’s insert to wait on the held row', async () => {
        const [row] = await sequelize.query<{ waiting: number }>(
          `SELECT count(*)::int AS waiting FROM pg_stat_activity WHERE wait_event_type = 'Lock' AND query LIKE 'INSERT INTO sightings%' AND position(:sha IN query) > 0`,
          { replacements: { sha: heldSha }, type: QueryTypes.SELECT },
        );
        return row.waiting === 1;
      });
      // The state at the moment of the kill: two photos whole, the third's file on disk without a committed row.
      const committed = await storedPhotos(setUp.org.id);
      expect(committed.map((p) => p.sha256).sort()).toEqual([sha256(photos[0]), sha256(photos[1])].sort());
      expect(filesOf(setUp.org.id)).toHaveLength(3);
      await killHard(server);
      await expect(upload.answered).rejects.toThrow();
    } finally {
      await hold.rollback();
    }

    const { removed, storedBefore } = await restartAndResend(setUp, session, photos, batch);
    expect([...storedBefore.keys()].sort()).toEqual([sha256(photos[0]), sha256(photos[1])].sort());
    expect(removed).toHaveLength(1);
  });
});
