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

/** A walk the scout started without signal: the server has it once `serverId` is set. */
export interface WalkStartedOffline {
  /** The phone's id for the walk; its photos and stops name it until the server answers. */
  id: string;
  ownerId: string;
  fieldId: string;
  fieldName: string;
  /** YYYY-MM-DD on the phone's calendar. */
  walkedOn: string;
  createdAt: number;
  /** The walk's id on the server: the phone's own, or the walk the scout had already started there that day. */
  serverId?: string;
  /** The server's reason when it would not start the walk (the field is no longer assigned, say). */
  refusal?: string;
}

interface OutboxSchema extends DBSchema {
  items: { key: string; value: QueuedItem };
  walks: { key: string; value: WalkStartedOffline };
}

const DB_NAME = 'patchwise-outbox';
const CHANNEL = 'patchwise-outbox';

let opened: Promise<IDBPDatabase<OutboxSchema>> | undefined;
const db = () =>
  (opened ??= openDB<OutboxSchema>(DB_NAME, 2, {
    upgrade(d, oldVersion) {
      if (oldVersion < 1) d.createObjectStore('items', { keyPath: 'clientId' });
      if (oldVersion < 2) d.createObjectStore('walks', { keyPath: 'id' });
    },
  }));

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
  await forgetSettledWalks(now);
  const items = await allQueued();
  const restored = outboxAfterRestart(items).filter((item, i) => item !== items[i]);
  const expired = outboxExpired(items, now);
  if (!restored.length && !expired.length) return;
  const tx = (await db()).transaction('items', 'readwrite');
  await Promise.all([...restored.map((i) => tx.store.put(i)), ...expired.map((i) => tx.store.delete(i.clientId)), tx.done]);
  announce();
}

export async function putWalkStartedOffline(walk: WalkStartedOffline) {
  await (await db()).put('walks', walk);
  announce();
}

export async function walkStartedOffline(id: string): Promise<WalkStartedOffline | undefined> {
  return (await db()).get('walks', id);
}

export async function walksStartedOffline(ownerId: string): Promise<WalkStartedOffline[]> {
  return (await (await db()).getAll('walks')).filter((w) => w.ownerId === ownerId).sort((a, b) => a.createdAt - b.createdAt);
}

/**
 * Records the server's answer for a walk started offline; when the server named another walk (the scout had started
 * that field's walk that day already), the photos and stops kept for the phone's id move to it.
 */
export async function settleWalkStartedOffline(id: string, answer: { serverId: string } | { refusal: string }) {
  const tx = (await db()).transaction(['walks', 'items'], 'readwrite');
  const walk = await tx.objectStore('walks').get(id);
  if (walk) await tx.objectStore('walks').put({ ...walk, ...answer });
  if ('serverId' in answer && answer.serverId !== id) {
    const items = tx.objectStore('items');
    for (const item of await items.getAll()) if (item.walkId === id) await items.put({ ...item, walkId: answer.serverId });
  }
  await tx.done;
  announce();
}

/** Walks started offline leave the phone a week after the server has them (their pages redirect until then). */
const OFFLINE_WALK_KEPT_MS = 7 * 24 * 60 * 60 * 1000;

async function forgetSettledWalks(now: number) {
  const store = (await db()).transaction('walks', 'readwrite').store;
  for (const walk of await store.getAll()) if (walk.serverId && now - walk.createdAt > OFFLINE_WALK_KEPT_MS) await store.delete(walk.id);
}

export type { PhotoOutcome };
