// Photos as files under root/<organisation>/<yyyy>/<uuid>.<ext>: written under a temporary name, flushed and renamed
// only when complete, so a crash leaves a whole file or none.
import crypto from 'node:crypto';
import fs from 'node:fs';
import fsp from 'node:fs/promises';
import path from 'node:path';
import type { ListedObject, PhotoStore } from './photo-store.ts';

export const TEMP_PREFIX = '.incoming-';

async function fsyncDirectory(dir: string) {
  const handle = await fsp.open(dir, 'r').catch(() => null);
  if (!handle) return;
  await handle.sync().catch(() => {});
  await handle.close();
}

export function folderStore(root: string, isKey: (key: string) => boolean): PhotoStore {
  const pathOf = (key: string) => {
    if (!isKey(key)) throw new Error(`not a storage key: ${key}`);
    return path.join(root, ...key.split('/'));
  };
  return {
    description: root,
    localPath: pathOf,
    async put(key, source) {
      const finalPath = pathOf(key);
      const dir = path.dirname(finalPath);
      await fsp.mkdir(dir, { recursive: true });
      const tempPath = path.join(dir, `${TEMP_PREFIX}${crypto.randomUUID()}`);
      try {
        if (source instanceof Uint8Array) {
          const handle = await fsp.open(tempPath, 'wx', 0o640);
          try {
            await handle.writeFile(source);
            await handle.sync();
          } finally {
            await handle.close();
          }
        } else {
          await fsp.copyFile(source.file, tempPath, fs.constants.COPYFILE_EXCL);
          const handle = await fsp.open(tempPath, 'r+');
          await handle.sync().finally(() => handle.close());
        }
        await fsp.rename(tempPath, finalPath);
      } catch (error) {
        await fsp.rm(tempPath, { force: true });
        throw error;
      }
      await fsyncDirectory(dir);
    },
    read: (key) => fsp.readFile(pathOf(key)),
    async readRange(key, start, end) {
      const handle = await fsp.open(pathOf(key), 'r');
      try {
        const buffer = Buffer.alloc(Math.max(0, end - start));
        const { bytesRead } = await handle.read(buffer, 0, buffer.length, start);
        return buffer.subarray(0, bytesRead);
      } finally {
        await handle.close();
      }
    },
    async open(key) {
      const file = pathOf(key);
      const stat = await fsp.stat(file).catch(() => null);
      if (!stat?.isFile()) return null;
      return { stream: fs.createReadStream(file), size: stat.size };
    },
    remove: (key) => fsp.rm(pathOf(key), { force: true }),
    removeListed: (entry) => fsp.rm(entry.path, { force: true }),
    async list() {
      const found: ListedObject[] = [];
      async function walk(dir: string, parts: string[]) {
        const entries = await fsp.readdir(dir, { withFileTypes: true }).catch(() => []);
        for (const entry of entries) {
          const full = path.join(dir, entry.name);
          if (entry.isDirectory()) {
            if (parts.length < 2) await walk(full, [...parts, entry.name]);
            continue;
          }
          // Only files inside organisation/year folders are ours (the root may hold .gitkeep and the like).
          if (!entry.isFile() || parts.length !== 2) continue;
          const key = [...parts, entry.name].join('/');
          const stat = await fsp.stat(full).catch(() => null);
          if (!stat) continue;
          found.push({ key: isKey(key) ? key : null, path: full, modifiedAt: stat.mtime });
        }
      }
      await walk(root, []);
      return found;
    },
    async check() {
      await fsp.mkdir(root, { recursive: true });
      await fsp.access(root, fs.constants.W_OK);
    },
  };
}
