// The upload spool engine on its own, behind multer in a bare Express app: the SHA-256 it takes while the bytes
// arrive is node:crypto's over the same JPEG, the temp file holds exactly the bytes sent, only the head stays in
// memory, and nothing is left in the spool folder once the request is done, refused for size, or cut off.
import crypto from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import express from 'express';
import multer from 'multer';
import request from 'supertest';
import { Jimp } from 'jimp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HEAD_BYTES } from '../../server/services/photo-source.ts';
import { STALE_SPOOL_MS, photoSpoolStorage, prepareSpool, releaseSpool, spoolMemory, type SpooledFile } from '../../server/services/photo-spool.ts';

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'patchwise-spool-test-'));
const spoolFiles = () => fs.readdirSync(dir);
const sha256 = (bytes: Uint8Array) => crypto.createHash('sha256').update(bytes).digest('hex');

/** A real JPEG (jimp's encoder) of noise, so it stays several times larger than the head the engine keeps. */
async function noisyJpeg(width: number, height: number) {
  const image = new Jimp({ width, height, color: 0x000000ff });
  let state = 12345;
  for (let i = 0; i < image.bitmap.data.length; i++) {
    state = (state * 1103515245 + 12345) >>> 0;
    if (i % 4 !== 3) image.bitmap.data[i] = state >>> 24;
  }
  return image.getBuffer('image/jpeg', { quality: 90 });
}

let photo: Buffer;
let seen: (SpooledFile & { buffer?: Buffer; onDisk: string }) | null = null;
const app = express();
app.post('/upload', multer({ storage: photoSpoolStorage(dir), limits: { fileSize: 4 * 1024 * 1024 } }).single('photo'), async (req, res) => {
  const file = req.file as unknown as SpooledFile & { buffer?: Buffer };
  seen = { ...file, onDisk: sha256(fs.readFileSync(file.path)) };
  await releaseSpool(req);
  res.json({ ok: true });
});
app.use((error: { code?: string }, _req: express.Request, res: express.Response, _next: express.NextFunction) => {
  res.status(413).json({ code: error.code });
});

let server: http.Server;
beforeAll(async () => {
  photo = await noisyJpeg(1200, 900);
  server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
});
afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  fs.rmSync(dir, { recursive: true, force: true });
});

async function until(what: string, check: () => boolean) {
  for (let i = 0; i < 200; i++) {
    if (check()) return;
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
  throw new Error(`gave up waiting for ${what}`);
}

describe('the photo spool engine', () => {
  it('hashes, counts and keeps only the head of a real JPEG, and leaves nothing behind', async () => {
    expect(photo.length).toBeGreaterThan(4 * HEAD_BYTES);
    spoolMemory.peakHeldBytes = spoolMemory.heldBytes;
    await request(app).post('/upload').attach('photo', photo, { filename: 'leaf.jpg', contentType: 'image/jpeg' }).expect(200);
    // Reference: node:crypto's SHA-256 (FIPS 180-4) over the bytes sent.
    expect(seen!.sha256).toBe(sha256(photo));
    expect(seen!.onDisk).toBe(sha256(photo));
    expect(seen!.size).toBe(photo.length);
    expect(Buffer.compare(seen!.head, photo.subarray(0, HEAD_BYTES))).toBe(0);
    // Not held whole: multer's memory buffer is absent and the engine never kept more than the head.
    expect(seen!.buffer).toBeUndefined();
    expect(spoolMemory.peakHeldBytes).toBeLessThanOrEqual(HEAD_BYTES);
    expect(spoolMemory.heldBytes).toBe(0);
    expect(spoolFiles()).toEqual([]);
  });

  it('refuses a file over the size limit while it streams and removes what was spooled', async () => {
    const big = Buffer.concat([photo, photo, photo, photo, photo]);
    expect(big.length).toBeGreaterThan(4 * 1024 * 1024);
    const res = await request(app).post('/upload').attach('photo', big, { filename: 'big.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(413);
    expect(res.body.code).toBe('LIMIT_FILE_SIZE');
    await until('the spool folder to empty', () => spoolFiles().length === 0);
  });

  it('removes the temp file when the client goes away halfway through the photo', async () => {
    const boundary = 'spool-test-boundary';
    const opening = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="photo"; filename="cut.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`);
    const closing = Buffer.from(`\r\n--${boundary}--\r\n`);
    const { port } = server.address() as AddressInfo;
    const req = http.request({
      host: '127.0.0.1',
      port,
      path: '/upload',
      method: 'POST',
      headers: { 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': opening.length + photo.length + closing.length },
    });
    req.on('error', () => {});
    req.write(Buffer.concat([opening, photo.subarray(0, photo.length / 2)]));
    await until('the half photo to reach the spool folder', () => spoolFiles().length === 1);
    req.destroy();
    await until('the spool folder to empty', () => spoolFiles().length === 0);
    expect(spoolMemory.heldBytes).toBe(0);
  });

  it('clears temp files a killed process left when a process starts, and keeps those of uploads still running', async () => {
    const now = Date.now();
    fs.writeFileSync(path.join(dir, 'left-by-a-crash.part'), 'half a photo');
    fs.writeFileSync(path.join(dir, 'arriving.part'), 'half a photo');
    const old = new Date(now - STALE_SPOOL_MS - 1000);
    fs.utimesSync(path.join(dir, 'left-by-a-crash.part'), old, old);
    expect(await prepareSpool(dir, now)).toEqual(['left-by-a-crash.part']);
    expect(spoolFiles()).toEqual(['arriving.part']);
    fs.rmSync(path.join(dir, 'arriving.part'));
  });
});
