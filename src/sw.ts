// The scout's service worker: the app shell from the cache, the scout's fields, walks and pests network-first with
// the last answer kept for no signal, and a Background Sync wake-up that asks an open page to send the outbox.
import { clientsClaim } from 'workbox-core';
import { cleanupOutdatedCaches, createHandlerBoundToURL, precacheAndRoute, type PrecacheEntry } from 'workbox-precaching';
import { NavigationRoute, registerRoute } from 'workbox-routing';
import { NetworkFirst } from 'workbox-strategies';
import { SCOUT_API_CACHE, scoutReadCached } from './lib/offline-reads.ts';

// The DOM lib is this project's; the few worker names used here are spelled out.
interface WorkerScope {
  skipWaiting(): Promise<void>;
  clients: { matchAll(options: { type: 'window'; includeUncontrolled: boolean }): Promise<{ postMessage(message: unknown): void }[]> };
  addEventListener(type: 'sync', listener: (event: { tag: string; waitUntil(work: Promise<unknown>): void }) => void): void;
}
const worker = self as unknown as WorkerScope;
declare global {
  // Workbox writes the precache list where this name stands, so it must be spelled `self.__WB_MANIFEST` below.
  interface Window {
    __WB_MANIFEST: (string | PrecacheEntry)[];
  }
}

void worker.skipWaiting();
clientsClaim();
cleanupOutdatedCaches();
precacheAndRoute(self.__WB_MANIFEST);

// Every page of the client is the one index.html; the API and files are not pages.
registerRoute(new NavigationRoute(createHandlerBoundToURL('index.html'), { denylist: [/^\/api\//, /^\/uploads\//] }));

// A weak signal that answers nothing for seconds is worse than the kept copy: fall back after a few seconds.
registerRoute(
  ({ url, request }) => request.method === 'GET' && url.origin === location.origin && scoutReadCached(url.pathname),
  new NetworkFirst({ cacheName: SCOUT_API_CACHE, networkTimeoutSeconds: 4 }),
);

worker.addEventListener('sync', (event) => {
  if (event.tag !== 'patchwise-outbox') return;
  event.waitUntil(
    worker.clients.matchAll({ type: 'window', includeUncontrolled: true }).then((pages) => pages.forEach((page) => page.postMessage('drain-outbox'))),
  );
});
