// A multer storage engine that spools each uploaded photo to a temp file while it arrives: the SHA-256 and the byte
// count are taken on the way through and only the first HEAD_BYTES stay in memory, so a request never holds a
// whole photo. The temp files have names we make, in PHOTO_SPOOL_DIR, and go when the request is done with them.
import crypto from 'node:crypto';
import fs from 'node:fs';
import fsp from 'node:fs/promises';
import path from 'node:path';
import { Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Request } from 'express';
import type { StorageEngine } from 'multer';
import { config } from '../config.ts';
import { HEAD_BYTES } from './photo-source.ts';

/** What the engine adds to multer's file object. */
export interface SpooledFile {
  path: string;
  size: number;
  sha256: string;
  head: Buffer;
}

/** Bytes of photo data the engine holds in memory right now, and the most it ever held (inspectable by tests). */
export const spoolMemory = { heldBytes: 0, peakHeldBytes: 0 };

const SPOOL_SUFFIX = '.part';

const spooledByRequest = new WeakMap<Request, Set<string>>();

/** Creates the spool folder (at start, and before each file in case someone cleared the temp folder since). */
export async function ensureSpoolDir(dir = config.photoSpoolDir) {
  await fsp.mkdir(dir, { recursive: true, mode: 0o700 });
}

const remove = (file: string) => fsp.rm(file, { force: true });

/**
 * Left by a process killed mid-upload: temp files untouched for this long. Node cuts a request body off after 5 minutes
 * (http.Server requestTimeout) and the ingest after it takes seconds, so no upload still running, even one in another
 * process sharing the folder, has a file this old.
 */
export const STALE_SPOOL_MS = 15 * 60_000;

/** Makes the spool folder and removes what a killed process left in it; run when a web process starts. */
export async function prepareSpool(dir = config.photoSpoolDir, now = Date.now()) {
  await ensureSpoolDir(dir);
  const removed: string[] = [];
  for (const name of await fsp.readdir(dir)) {
    if (!name.endsWith(SPOOL_SUFFIX)) continue;
    const file = path.join(dir, name);
    const stat = await fsp.stat(file).catch(() => null);
    if (!stat?.isFile() || now - stat.mtimeMs < STALE_SPOOL_MS) continue;
    await remove(file);
    removed.push(name);
  }
  return removed;
}

/** Removes every temp file this request spooled; safe to call more than once. */
export async function releaseSpool(req: Request) {
  const files = spooledByRequest.get(req);
  if (!files) return;
  spooledByRequest.delete(req);
  await Promise.all([...files].map(remove));
}

function track(req: Request, file: string) {
  let files = spooledByRequest.get(req);
  if (!files) spooledByRequest.set(req, (files = new Set()));
  files.add(file);
}

/** Hashes, counts and keeps the head of the bytes passing through, unchanged. */
function tap() {
  const hash = crypto.createHash('sha256');
  const head: Buffer[] = [];
  let headLength = 0;
  let size = 0;
  const stream = new Transform({
    transform(chunk: Buffer, _encoding, callback) {
      hash.update(chunk);
      size += chunk.length;
      if (headLength < HEAD_BYTES) {
        // A copy of just the part needed, so the head never pins a larger chunk in memory.
        const part = Buffer.from(chunk.subarray(0, HEAD_BYTES - headLength));
        head.push(part);
        headLength += part.length;
        spoolMemory.heldBytes += part.length;
        spoolMemory.peakHeldBytes = Math.max(spoolMemory.peakHeldBytes, spoolMemory.heldBytes);
      }
      callback(null, chunk);
    },
  });
  const release = () => {
    spoolMemory.heldBytes -= headLength;
  };
  return { stream, result: () => ({ size, sha256: hash.digest('hex'), head: Buffer.concat(head, headLength) }), release };
}

export function photoSpoolStorage(dir = config.photoSpoolDir): StorageEngine {
  return {
    _handleFile(req, file, callback) {
      const target = path.join(dir, `${crypto.randomUUID()}${SPOOL_SUFFIX}`);
      track(req, target);
      const meter = tap();
      ensureSpoolDir(dir)
        .then(() => pipeline(file.stream, meter.stream, fs.createWriteStream(target, { flags: 'wx', mode: 0o600 })))
        .then(
          () => {
            const { size, sha256, head } = meter.result();
            meter.release();
            const spooled: SpooledFile = { path: target, size, sha256, head };
            callback(null, spooled);
          },
          (error: unknown) => {
            // The upload broke off (aborted, cut, or the disk refused): nothing of it stays.
            meter.release();
            remove(target).finally(() => callback(error as Error));
          },
        );
    },
    _removeFile(_req, file, callback) {
      remove(file.path).then(
        () => callback(null),
        (error: Error) => callback(error),
      );
    },
  };
}
