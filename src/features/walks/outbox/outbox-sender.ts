// Sends the outbox: oldest first, two at a time, each item marked on its way, then sent, refused (with the server's
// reason) or back to waiting when the connection is not there. One drain at a time across the phone's tabs.
import { api, ApiError, setCsrfToken } from '../../../lib/api-client.ts';
import type { SightingView } from '@shared/schemas/sightings.ts';
import { csrfTokenForUpload, PhotoUploadError, uploadPhoto } from '../api/upload-photo.ts';
import { afterAttempt, drainQueue, outboxToSend, sendResultOf, type SendResult } from '../upload-queue.ts';
import { createWalk } from '../api/create-walk.ts';
import {
  allQueued,
  patchQueued,
  putQueued,
  settleWalkStartedOffline,
  walksStartedOffline,
  type QueuedItem,
  type QueuedPhoto,
  type QueuedStop,
} from './outbox-store.ts';

const PARALLEL_SENDS = 2;
const NO_CONNECTION = 'No connection yet: it goes by itself when the phone has signal.';

const sentListeners = new Set<(item: QueuedItem) => void>();
/** Told after each item that was sent, so the pages showing its walk can refresh. */
export function onItemSent(listener: (item: QueuedItem) => void) {
  sentListeners.add(listener);
  return () => void sentListeners.delete(listener);
}

function unreachable(error: unknown): SendResult | null {
  if (error instanceof TypeError) return { kind: 'unreachable', message: NO_CONNECTION };
  if (error instanceof PhotoUploadError && error.retryable) return { kind: 'unreachable', message: error.message };
  // Status 0: the request never got an answer (the API client's "cannot be reached").
  if (error instanceof ApiError && (error.status === 0 || error.status >= 500 || error.code === 'csrf')) return { kind: 'unreachable', message: error.message };
  // Signed out on this phone: the item waits for the next sign-in rather than being refused.
  if (error instanceof ApiError && error.status === 401) return { kind: 'unreachable', message: 'Sign in again to send what waits on this phone.' };
  return null;
}

async function sendPhoto(item: QueuedPhoto, onProgress: (share: number) => void): Promise<SendResult> {
  const file = new File([item.file], item.fileName, { type: item.file.type });
  const outcome = await uploadPhoto(
    { file, clientId: item.clientId, pestId: item.pestId, count: item.count, walkId: item.walkId, fieldId: item.fieldId },
    await csrfTokenForUpload(),
    onProgress,
  );
  return sendResultOf(outcome);
}

async function sendStop(item: QueuedStop): Promise<SendResult> {
  await api<{ sighting: SightingView }>(`/api/walks/${encodeURIComponent(item.walkId)}/stops`, {
    method: 'POST',
    body: { pestId: item.pestId, lon: item.lon, lat: item.lat, accuracyM: item.accuracyM, clientId: item.clientId, observedAt: item.observedAt },
  });
  return { kind: 'sent' };
}

async function attempt(item: QueuedItem, onProgress: (share: number) => void): Promise<SendResult> {
  if (typeof navigator !== 'undefined' && navigator.onLine === false) return { kind: 'unreachable', message: NO_CONNECTION };
  try {
    return item.kind === 'photo' ? await sendPhoto(item, onProgress) : await sendStop(item);
  } catch (error) {
    if (error instanceof ApiError && error.code === 'csrf') setCsrfToken(null);
    return unreachable(error) ?? { kind: 'refused', message: (error as Error).message };
  }
}

const progressListeners = new Set<(clientId: string, share: number) => void>();
/** Upload progress is too frequent for IndexedDB: it goes to the screen only. */
export function onSendProgress(listener: (clientId: string, share: number) => void) {
  progressListeners.add(listener);
  return () => void progressListeners.delete(listener);
}

/**
 * Starts on the server the walks started without signal, oldest first; answers the phone ids whose walk the server
 * does not have yet, so their photos and stops wait for it.
 */
async function sendWalksStartedOffline(ownerId: string): Promise<Set<string>> {
  const unsettled = (await walksStartedOffline(ownerId)).filter((w) => !w.serverId && !w.refusal);
  const waiting = new Set(unsettled.map((w) => w.id));
  for (const walk of unsettled) {
    if (typeof navigator !== 'undefined' && navigator.onLine === false) break;
    try {
      const { walk: stored } = await createWalk({ id: walk.id, fieldId: walk.fieldId, walkedOn: walk.walkedOn });
      await settleWalkStartedOffline(walk.id, { serverId: stored.id });
      waiting.delete(walk.id);
    } catch (error) {
      if (error instanceof ApiError && error.code === 'csrf') setCsrfToken(null);
      if (unreachable(error)) break;
      // Refused (the field is no longer assigned, say): its items go to the server, which gives each its own reason.
      await settleWalkStartedOffline(walk.id, { refusal: (error as Error).message });
      waiting.delete(walk.id);
    }
  }
  return waiting;
}

async function drainOnce(ownerId: string) {
  let connectionLost = false;
  const walksNotThere = await sendWalksStartedOffline(ownerId);
  const ready = outboxToSend(await allQueued(ownerId)).filter((item) => !item.walkId || !walksNotThere.has(item.walkId));
  await drainQueue(ready, PARALLEL_SENDS, async (item) => {
    if (connectionLost) return;
    await patchQueued(item.clientId, (i) => ({ ...i, state: 'sending' }));
    const result = await attempt(item, (share) => progressListeners.forEach((l) => l(item.clientId, share)));
    if (result.kind === 'unreachable') connectionLost = true;
    const now = Date.now();
    await patchQueued(item.clientId, (i) => ({ ...afterAttempt(i, result), ...(result.kind === 'sent' ? { sentAt: now } : {}) }));
    if (result.kind !== 'sent') return;
    const sent = item.kind === 'photo' ? { ...item, outcome: result.outcome } : item;
    sentListeners.forEach((l) => l(sent));
  });
}

let running: Promise<number> | null = null;
let again = false;

/**
 * Sends what waits and answers how many items still wait (the connection went); a call during a drain runs one
 * more pass after it, so nothing recorded meanwhile is left behind.
 */
export function drainOutbox(ownerId: string): Promise<number> {
  if (running) {
    again = true;
    return running;
  }
  const pass = async () => {
    do {
      again = false;
      // Web Locks keep two tabs from sending the same item at once; without them this tab's own guard still holds.
      if (typeof navigator !== 'undefined' && navigator.locks) await navigator.locks.request('patchwise-outbox-drain', () => drainOnce(ownerId));
      else await drainOnce(ownerId);
    } while (again);
    return outboxToSend(await allQueued(ownerId)).length;
  };
  running = pass().finally(() => {
    running = null;
  });
  void running.then(
    (left) => retryLater(ownerId, left),
    () => retryLater(ownerId, 1),
  );
  return running;
}

// A connection that answers nothing (a dead Wi-Fi, a server restarting) raises no online event: try again later, less often.
const RETRY_FIRST_MS = 5_000;
const RETRY_MOST_MS = 120_000;
let retryMs = RETRY_FIRST_MS;
let retryTimer: ReturnType<typeof setTimeout> | undefined;

function retryLater(ownerId: string, left: number) {
  clearTimeout(retryTimer);
  if (!left) {
    retryMs = RETRY_FIRST_MS;
    return;
  }
  // Offline, the online event starts the next drain.
  if (typeof navigator !== 'undefined' && navigator.onLine === false) return;
  retryTimer = setTimeout(() => void drainOutbox(ownerId), retryMs);
  retryMs = Math.min(retryMs * 2, RETRY_MOST_MS);
}

/** The connection is back: the next wait starts short again. */
export function resetRetryDelay() {
  retryMs = RETRY_FIRST_MS;
}

/** Keeps an item on the phone and sends it at once if it can. */
export async function queueAndSend(...items: QueuedItem[]) {
  await putQueued(...items);
  for (const ownerId of new Set(items.map((i) => i.ownerId))) void drainOutbox(ownerId);
}
