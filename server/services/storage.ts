// Photo storage behind one interface: the local folder (default) or an S3-compatible bucket, chosen by STORAGE_URL.
// Keys are <organisation>/<yyyy>/<uuid>.<ext>, made here, never from a user's file name.
import crypto from 'node:crypto';
import { config } from '../config.ts';
import { folderStore } from './storage/folder-store.ts';
import { s3Store } from './storage/s3-store.ts';
import type { ListedObject, PhotoStore } from './storage/photo-store.ts';

export { TEMP_PREFIX } from './storage/folder-store.ts';
export type StoredFile = ListedObject;

const uuid = '[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}';
const keyPattern = new RegExp(`^${uuid}/\\d{4}/${uuid}(-thumb)?\\.(jpg|png|webp|heic|heif)$`);
export const isStorageKey = (key: string) => keyPattern.test(key);

let store: PhotoStore | null = null;

/** The store STORAGE_URL names (made once per process). */
export function photoStore(): PhotoStore {
  if (store) return store;
  const location = config.storage;
  store = location.driver === 'file' ? folderStore(location.root, isStorageKey) : s3Store(location, isStorageKey);
  return store;
}

export function newStorageKey(organisationId: string, extension: string, when = new Date()) {
  return `${organisationId}/${when.getUTCFullYear()}/${crypto.randomUUID()}.${extension}`;
}

export const thumbnailKeyFor = (storageKey: string) => storageKey.replace(/\.[a-z]+$/, '-thumb.jpg');

/** The absolute path of a key in the local folder store, refusing anything that is not a key this module made. */
export function storedPath(key: string) {
  const local = photoStore().localPath(key);
  if (!local) throw new Error('photos are not stored in a local folder (STORAGE_URL names a bucket)');
  return local;
}

/** Stores bytes, or a finished temp file, under the key; a crash leaves a whole object or none. */
export async function writeStored(key: string, source: Uint8Array | { file: string; size: number }) {
  await photoStore().put(key, source);
}

export const readStored = (key: string) => photoStore().read(key);
export const readStoredRange = (key: string, start: number, end: number) => photoStore().readRange(key, start, end);
export const openStored = (key: string) => photoStore().open(key);

export async function removeStored(key: string | null | undefined) {
  if (!key) return;
  await photoStore().remove(key);
}

/** Every object in the store's organisation/year layout, ours or not. */
export const listStoredFiles = () => photoStore().list();
export const removeListedFile = (entry: StoredFile) => photoStore().removeListed(entry);
export const storageReachable = () => photoStore().check();
