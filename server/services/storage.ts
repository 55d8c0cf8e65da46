// Photo files on disk under uploadDir/<organisation>/<yyyy>/<uuid>.<ext>. Keys are made here, never from a
// user's file name; a file is written under a temporary name, flushed and renamed only when complete.
import crypto from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import { config } from '../config.ts';

const uuid = '[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}';
const keyPattern = new RegExp(`^${uuid}/\\d{4}/${uuid}(-thumb)?\\.(jpg|png|webp|heic|heif)$`);
export const TEMP_PREFIX = '.incoming-';

export const storageRoot = () => config.uploadDir;

export function newStorageKey(organisationId: string, extension: string, when = new Date()) {
  return `${organisationId}/${when.getUTCFullYear()}/${crypto.randomUUID()}.${extension}`;
}

export const thumbnailKeyFor = (storageKey: string) => storageKey.replace(/\.[a-z]+$/, '-thumb.jpg');

/** The absolute path of a key, refusing anything that is not a key this module made. */
export function storedPath(key: string) {
  if (!keyPattern.test(key)) throw new Error(`not a storage key: ${key}`);
  return path.join(storageRoot(), ...key.split('/'));
}

async function fsyncDirectory(dir: string) {
  const handle = await fs.open(dir, 'r').catch(() => null);
  if (!handle) return;
  await handle.sync().catch(() => {});
  await handle.close();
}

/** Writes bytes under the key: temp file, fsync, rename, fsync of the folder (so a crash leaves a whole file or none). */
export async function writeStored(key: string, bytes: Uint8Array) {
  const finalPath = storedPath(key);
  const dir = path.dirname(finalPath);
  await fs.mkdir(dir, { recursive: true });
  const tempPath = path.join(dir, `${TEMP_PREFIX}${crypto.randomUUID()}`);
  const handle = await fs.open(tempPath, 'wx', 0o640);
  try {
    await handle.writeFile(bytes);
    await handle.sync();
  } finally {
    await handle.close();
  }
  try {
    await fs.rename(tempPath, finalPath);
  } catch (error) {
    await fs.rm(tempPath, { force: true });
    throw error;
  }
  await fsyncDirectory(dir);
  return finalPath;
}

export const readStored = (key: string) => fs.readFile(storedPath(key));

export async function removeStored(key: string | null | undefined) {
  if (!key) return;
  await fs.rm(storedPath(key), { force: true });
}

export interface StoredFile {
  /** Storage key, or null for a file that is not one of ours (a temp file, a stray). */
  key: string | null;
  path: string;
  modifiedAt: Date;
}

/** Every file in the upload folder's organisation/year folders. */
export async function listStoredFiles(): Promise<StoredFile[]> {
  const root = storageRoot();
  const found: StoredFile[] = [];
  async function walk(dir: string, parts: string[]) {
    const entries = await fs.readdir(dir, { withFileTypes: true }).catch(() => []);
    for (const entry of entries) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) {
        if (parts.length < 2) await walk(full, [...parts, entry.name]);
        continue;
      }
      // Only files inside organisation/year folders are ours (the root may hold .gitkeep and the like).
      if (!entry.isFile() || parts.length !== 2) continue;
      const key = [...parts, entry.name].join('/');
      const stat = await fs.stat(full).catch(() => null);
      if (!stat) continue;
      found.push({ key: keyPattern.test(key) ? key : null, path: full, modifiedAt: stat.mtime });
    }
  }
  await walk(root, []);
  return found;
}
