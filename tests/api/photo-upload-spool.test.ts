// POST /api/photos spools each photo to a temp file while it arrives instead of holding it in memory: a large real
// JPEG is placed with the SHA-256 node:crypto gives for its bytes, only the head was ever in memory, and the spool
// folder is empty afterwards, whether the upload was placed, refused for its content or size, or cut off halfway.
import { vi, afterAll, beforeAll, describe, expect, it } from 'vitest';

const spoolDir = await vi.hoisted(async () => {
  // Before any server module reads its configuration: a spool folder of this suite's own, to look into.
  const { mkdtempSync } = await import('node:fs');
  const { join } = await import('node:path');
  const { tmpdir } = await import('node:os');
  const dir = mkdtempSync(join(tmpdir(), 'patchwise-upload-spool-'));
  process.env.PHOTO_SPOOL_DIR = dir;
  return dir;
});

import crypto from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { Jimp } from 'jimp';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeThumbnailPool } from '../../server/services/thumbnail-pool.ts';
import { HEAD_BYTES } from '../../server/services/photo-source.ts';
import { spoolMemory } from '../../server/services/photo-spool.ts';
import { storedPath } from '../../server/services/storage.ts';
import { photoFilePart } from '../../shared/schemas/sightings.ts';
import { testApp } from '../helpers/http.ts';
import { TEST_PASSWORD } from '../helpers/org.ts';
import { insideField, makeJpeg, rowCounts, scoutingSetUp, uploadPhotos, withExif } from '../helpers/photos.ts';

const spoolFiles = () => fs.readdirSync(spoolDir);
const sha256 = (bytes: Uint8Array) => crypto.createHash('sha256').update(bytes).digest('hex');

/** A real JPEG (jimp's encoder) of noise with GPS EXIF (piexifjs), several times larger than the head kept in memory. */
async function largeJpeg(seed: number) {
  const image = new Jimp({ width: 1200, height: 900, color: 0x000000ff });
  let state = seed;
  for (let i = 0; i < image.bitmap.data.length; i++) {
    state = (state * 1103515245 + 12345) >>> 0;
    if (i % 4 !== 3) image.bitmap.data[i] = state >>> 24;
  }
  return withExif(await image.getBuffer('image/jpeg', { quality: 90 }), { gps: insideField(0.3, 0.6) });
}

async function until(what: string, check: () => boolean | Promise<boolean>) {
  for (let i = 0; i < 400; i++) {
    if (await check()) return;
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
  throw new Error(`gave up waiting for ${what}`);
}

let server: http.Server;
let base: string;
beforeAll(async () => {
  server = await new Promise((resolve) => {
    const s = testApp().listen(0, '127.0.0.1', () => resolve(s));
  });
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  server.closeAllConnections();
  await new Promise((resolve) => server.close(resolve));
  await stopQueue();
  await closeThumbnailPool();
  fs.rmSync(spoolDir, { recursive: true, force: true });
});

const cookiesOf = (res: Response) =>
  res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');

/** Signs in over plain HTTP, for a raw request the test can cut off. */
async function signInOverHttp(email: string) {
  const csrfRes = await fetch(`${base}/api/auth/csrf`);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', cookie: cookiesOf(csrfRes), 'x-csrf-token': csrfToken },
    body: JSON.stringify({ email, password: TEST_PASSWORD }),
  });
  expect(res.status).toBe(200);
  return { cookie: cookiesOf(res), csrf: ((await res.json()) as { csrfToken: string }).csrfToken };
}

describe('photo uploads spooled to temp files', () => {
  it('places a large JPEG with the SHA-256 of its bytes, holding only its head in memory, and empties the spool', async () => {
    const { scout, pest } = await scoutingSetUp();
    const photo = await largeJpeg(7);
    expect(photo.length).toBeGreaterThan(4 * HEAD_BYTES);
    spoolMemory.peakHeldBytes = spoolMemory.heldBytes;
    const res = await uploadPhotos(scout, [{ bytes: photo, name: 'leaf.jpg' }], { pestId: pest.id }).expect(200);
    expect(res.body.results[0].outcome).toBe('placed');
    const [row] = await sequelize.query<{ sha256: string; byte_size: number; storage_key: string }>(
      'SELECT sha256, byte_size, storage_key FROM photos WHERE id = :id',
      { replacements: { id: res.body.results[0].photoId }, type: QueryTypes.SELECT },
    );
    // Reference: node:crypto's SHA-256 (FIPS 180-4) over the bytes sent, and the stored file read back.
    expect(row.sha256).toBe(sha256(photo));
    expect(Number(row.byte_size)).toBe(photo.length);
    expect(sha256(fs.readFileSync(storedPath(row.storage_key)))).toBe(sha256(photo));
    expect(spoolMemory.peakHeldBytes).toBeLessThanOrEqual(HEAD_BYTES);
    expect(spoolFiles()).toEqual([]);
  });

  it('empties the spool after refusing a file that is not a photo', async () => {
    const { org, scout, pest } = await scoutingSetUp();
    const before = await rowCounts(org.id);
    const res = await uploadPhotos(scout, [{ bytes: Buffer.from('not a photo at all, just words\n'.repeat(20_000)), name: 'notes.jpg' }], {
      pestId: pest.id,
    }).expect(200);
    expect(res.body.results[0].outcome).toBe('rejected');
    expect(res.body.results[0].message).toMatch(/not a recognisable image/);
    expect(await rowCounts(org.id)).toEqual(before);
    expect(spoolFiles()).toEqual([]);
  });

  it('refuses a photo over the size limit with the usual sentence and removes it and the photo before it from the spool', async () => {
    const { org, scout, pest } = await scoutingSetUp();
    const photo = await largeJpeg(11);
    const before = await rowCounts(org.id);
    process.env.PHOTO_MAX_FILE_MB = '0.5';
    try {
      const small = await makeJpeg({ gps: insideField(0.2, 0.2) });
      const res = await uploadPhotos(
        scout,
        [
          { bytes: small, name: 'small.jpg' },
          { bytes: photo, name: 'big.jpg' },
        ],
        { pestId: pest.id },
      );
      expect(res.status).toBe(413);
      expect(res.body.error.message).toBe('“big.jpg” is larger than 0.5 MB; nothing from this upload was kept. Send it at a smaller size.');
    } finally {
      delete process.env.PHOTO_MAX_FILE_MB;
    }
    expect(await rowCounts(org.id)).toEqual(before);
    await until('the spool folder to empty', () => spoolFiles().length === 0);
  });

  it('removes the temp file and stores nothing when the phone goes away halfway through a photo', async () => {
    const { org, pest } = await scoutingSetUp();
    const session = await signInOverHttp(org.users.scout.email);
    const photo = await largeJpeg(13);
    const form = new FormData();
    form.append('pestId', pest.id);
    form.append(photoFilePart, new Blob([new Uint8Array(photo)], { type: 'image/jpeg' }), 'cut.jpg');
    const encoded = new Request(base, { method: 'POST', body: form });
    const body = Buffer.from(await encoded.arrayBuffer());
    const before = await rowCounts(org.id);
    const req = http.request(`${base}/api/photos`, {
      method: 'POST',
      headers: { 'content-type': encoded.headers.get('content-type')!, 'content-length': body.length, cookie: session.cookie, 'x-csrf-token': session.csrf },
    });
    req.on('error', () => {});
    req.write(body.subarray(0, body.length / 2));
    await until('half the photo to reach the spool folder', () => spoolFiles().length === 1);
    req.destroy();
    await until('the spool folder to empty', () => spoolFiles().length === 0);
    expect(await rowCounts(org.id)).toEqual(before);
  });
});
