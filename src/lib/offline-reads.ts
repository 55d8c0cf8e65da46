// Which server reads the service worker keeps for use without signal: what the scout's pages need to open in a field.
export const SCOUT_API_CACHE = 'patchwise-scout-api';

const kept = [
  /^\/api\/auth\/me$/,
  /^\/api\/config$/,
  /^\/api\/pests$/,
  /^\/api\/fields$/,
  /^\/api\/fields\/[0-9a-f-]{36}$/,
  /^\/api\/walks$/,
  /^\/api\/walks\/[0-9a-f-]{36}$/,
];

export const scoutReadCached = (pathname: string) => kept.some((pattern) => pattern.test(pathname));

/** On sign-out the kept answers go, so the next person on this phone sees nothing of the last one's. */
export async function forgetOfflineReads() {
  if (typeof caches !== 'undefined') await caches.delete(SCOUT_API_CACHE);
}
