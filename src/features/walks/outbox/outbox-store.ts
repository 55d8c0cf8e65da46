// The outbox in IndexedDB: photos (with their files) and empty stops kept on the phone until they are sent,
// through a reload, a closed tab or a restarted phone. Every change is announced to this tab and the others.
import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { PhotoOutcome } from '@shared/schemas/sightings.ts';
import { outboxAfterRestart, outboxExpired, type OutboxItemState } from '../upload-queue.ts';

interface OutboxBase extends OutboxItemState {
  /** The scout who recorded it: only their session sends it, never the next person's on a shared phone. */
  ownerId: string;
  pestId: string;
  /** Date.now() when the scout recorded it. */
  createdAt: number;
  sentAt?: number;
  walkId?: string;
  fieldId?: string;
}

export interface QueuedPhoto extends OutboxBase {
  kind: 'photo';
  file: Blob;
  fileName: string;
  count?: number;
  /** A small JPEG made on the phone, shown while the photo waits. */
  preview?: Blob;
  /** The photo's EXIF position as the phone read it, for the walk map while it waits. */
  position?: { lon: number; lat: number };
}

export interface QueuedStop extends OutboxBase {
  kind: 'stop';
  walkId: string;
  lon: number;
  lat: number;
  accuracyM: number;
  /** ISO time the stop was recorded. */
  observedAt: string;
}

export type QueuedItem = QueuedPhoto | QueuedStop;

interface OutboxSchema extends DBSchema {
  items: { key: string; value: QueuedItem };
}

const DB_NAME = 'patchwise-outbox';
const CHANNEL = 'patchwise-outbox';

let opened: Promise<IDBPDatabase<OutboxSchema>> | undefined;
const db = () => (opened ??= openDB<OutboxSchema>(DB_NAME, 1, { upgrade: (d) => void d.createObjectStore('items', { keyPath: 'clientId' }) }));

const listeners = new Set<() => void>();
const channel = typeof BroadcastChannel === 'undefined' ? null : new BroadcastChannel(CHANNEL);
channel?.addEventListener('message', () => listeners.forEach((l) => l()));

function announce() {
  listeners.forEach((l) => l());
  channel?.postMessage('changed');
}

/** Calls `listener` after every change to the outbox, in this tab or another. */
export function onOutboxChange(listener: () => void) {
  listeners.add(listener);
  return () => void listeners.delete(listener);
}

/** The outbox, oldest first; with an owner, only that scout's items. */
export async function allQueued(ownerId?: string): Promise<QueuedItem[]> {
  const items = await (await db()).getAll('items');
  return items.filter((item) => ownerId === undefined || item.ownerId === ownerId).sort((a, b) => a.createdAt - b.createdAt);
}

export async function putQueued(...items: QueuedItem[]) {
  const tx = (await db()).transaction('items', 'readwrite');
  await Promise.all([...items.map((item) => tx.store.put(item)), tx.done]);
  announce();
}

export async function patchQueued(clientId: string, change: (item: QueuedItem) => QueuedItem) {
  const tx = (await db()).transaction('items', 'readwrite');
  const item = await tx.store.get(clientId);
  if (item) await tx.store.put(change(item));
  await tx.done;
  announce();
}

export async function removeQueued(clientId: string) {
  await (await db()).delete('items', clientId);
  announce();
}

/** On app start: items left on their way are put back to wait, sent ones older than a day leave the phone. */
export async function tidyOutbox(now = Date.now()) {
  const items = await allQueued();
  const restored = outboxAfterRestart(items).filter((item, i) => item !== items[i]);
  const expired = outboxExpired(items, now);
  if (!restored.length && !expired.length) return;
  const tx = (await db()).transaction('items', 'readwrite');
  await Promise.all([...restored.map((i) => tx.store.put(i)), ...expired.map((i) => tx.store.delete(i.clientId)), tx.done]);
  announce();
}

export type { PhotoOutcome };
