// The outbox as React state: the items kept on the phone, whether the phone has a connection, and the drain's triggers.
import { useEffect, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useSignedInUser } from '../../../lib/auth.ts';
import { walkQueryKey } from '../api/get-walk.ts';
import { walkListsQueryKey } from '../../../lib/api/get-walks.ts';
import { allQueued, onOutboxChange, tidyOutbox, walksStartedOffline, type QueuedItem, type WalkStartedOffline } from './outbox-store.ts';
import { drainOutbox, onItemSent, onSendProgress, resetRetryDelay } from './outbox-sender.ts';

/** What `read` answers for the signed-in scout, read again after every outbox change in this tab or another. */
function useOutboxRead<T>(read: (ownerId: string) => Promise<T[]>): T[] {
  const ownerId = useSignedInUser().id;
  const [rows, setRows] = useState<T[]>([]);
  useEffect(() => {
    let live = true;
    // A draining queue changes the outbox twice per item: one read at a time, and one more after it if anything
    // changed meanwhile, so fifty changes in a burst cost a few reads, not fifty reads of every item.
    let reading = false;
    let changedSince = false;
    const load = () => {
      if (reading) {
        changedSince = true;
        return;
      }
      reading = true;
      changedSince = false;
      void read(ownerId)
        .then(
          (all) => live && setRows(all),
          () => {},
        )
        .finally(() => {
          reading = false;
          if (live && changedSince) load();
        });
    };
    load();
    const stop = onOutboxChange(load);
    return () => {
      live = false;
      stop();
    };
  }, [ownerId, read]);
  return rows;
}

/** The signed-in scout's items in the outbox. */
export const useOutbox = (): QueuedItem[] => useOutboxRead(allQueued);

/** The signed-in scout's walks started on this phone without signal, settled or not. */
export const useWalksStartedOffline = (): WalkStartedOffline[] => useOutboxRead(walksStartedOffline);

/** Share of each photo's bytes on their way, by client id. */
export function useSendProgress(): ReadonlyMap<string, number> {
  const [progress, setProgress] = useState<ReadonlyMap<string, number>>(new Map());
  useEffect(() => {
    // Progress events come many times a frame while bytes go out; the screen takes them once a frame.
    const pending = new Map<string, number>();
    let frame: number | undefined;
    const flush = () => {
      frame = undefined;
      const batch = new Map(pending);
      pending.clear();
      setProgress((map) => new Map([...map, ...batch]));
    };
    const stop = onSendProgress((clientId, share) => {
      pending.set(clientId, share);
      frame ??= requestAnimationFrame(flush);
    });
    return () => {
      stop();
      if (frame !== undefined) cancelAnimationFrame(frame);
    };
  }, []);
  return progress;
}

export function useOnline() {
  const [online, setOnline] = useState(() => navigator.onLine);
  useEffect(() => {
    const on = () => setOnline(true);
    const off = () => setOnline(false);
    window.addEventListener('online', on);
    window.addEventListener('offline', off);
    return () => {
      window.removeEventListener('online', on);
      window.removeEventListener('offline', off);
    };
  }, []);
  return online;
}

const SYNC_TAG = 'patchwise-outbox';
const WALK_REFRESH_EVERY_MS = 1_000;

/** Asks the browser to wake the service worker when a connection returns (Background Sync, where the browser has it). */
export async function askForBackgroundSync() {
  try {
    const registration = await navigator.serviceWorker?.getRegistration();
    const sync = (registration as (ServiceWorkerRegistration & { sync?: { register(tag: string): Promise<void> } }) | undefined)?.sync;
    await sync?.register(SYNC_TAG);
  } catch {
    // No Background Sync (Firefox, Safari) or no worker yet: the online event and the next start still send.
  }
}

/**
 * Sends the outbox on start, whenever the connection returns and when the service worker relays a Background Sync
 * (the sender itself tries again later while items are left and the phone says it is online); the walks whose items
 * arrived are fetched again.
 */
export function useOutboxSending() {
  const queryClient = useQueryClient();
  const ownerId = useSignedInUser().id;
  useEffect(() => {
    const drain = () => void drainOutbox(ownerId);
    const online = () => {
      resetRetryDelay();
      drain();
    };
    const fromWorker = (event: MessageEvent) => {
      if (event.data === 'drain-outbox') drain();
    };
    // A draining queue sends an item every few hundred milliseconds; the walks are fetched again at most once a
    // second, not after each item (fifty photos would otherwise fetch a growing walk fifty times).
    const sentWalks = new Set<string>();
    let refresh: ReturnType<typeof setTimeout> | undefined;
    const refreshWalks = () => {
      refresh = undefined;
      for (const walkId of sentWalks) void queryClient.invalidateQueries({ queryKey: walkQueryKey(walkId) });
      sentWalks.clear();
      void queryClient.invalidateQueries({ queryKey: walkListsQueryKey });
    };
    const stopSent = onItemSent((item) => {
      const walkId = item.walkId ?? (item.kind === 'photo' ? item.outcome?.walkId : undefined);
      if (walkId) sentWalks.add(walkId);
      refresh ??= setTimeout(refreshWalks, WALK_REFRESH_EVERY_MS);
    });
    void tidyOutbox().then(drain, drain);
    window.addEventListener('online', online);
    navigator.serviceWorker?.addEventListener('message', fromWorker);
    return () => {
      window.removeEventListener('online', online);
      navigator.serviceWorker?.removeEventListener('message', fromWorker);
      stopSent();
      if (refresh) {
        clearTimeout(refresh);
        refreshWalks();
      }
    };
  }, [queryClient, ownerId]);
}
