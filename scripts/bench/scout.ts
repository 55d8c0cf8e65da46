// Scout bench: the built app in Debian's Chromium on a phone profile, against the real server over a throwaway,
// seeded database. Two tables, each beside a reference run on the same data in the same run:
// - the walk page opened from the service worker's cache with the network off, beside the same page fetched from
//   the network with service workers blocked;
// - the outbox draining BENCH_SCOUT_PHOTOS (50 by default) photos queued offline once the signal returns, beside
//   the same photos (fresh bytes, so none is a duplicate) posted straight from Node two at a time, as the phone sends.
// Measures; never asserts a time. Needs the built client (`npx vite build`), which it makes when missing.
import { spawnSync } from 'node:child_process';
import type { AddressInfo } from 'node:net';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { median } from 'simple-statistics';
import { DEMO_PASSWORD, demoUsers } from '../seed/demo-scenario.ts';
import { projectRoot } from '../lib/local-env.ts';
import { startThrowawayDatabase } from './lib/throwaway-database.ts';
import { pointsInsideField } from './lib/field-points.ts';
import { withComment } from './lib/photo-bodies.ts';
import { signInForBench, type BenchSession } from './lib/bench-session.ts';
import type { BenchTable } from './table.ts';

const SHELL_OPENS = 5;
const PARALLEL_SENDS = 2; // as src/features/walks/outbox/outbox-sender.ts sends
const DRAIN_TIMEOUT_MS = 10 * 60_000;
const CHROMIUM_ARGS = ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];

const fixed = (v: number, digits = 0) => Number(v.toFixed(digits));

/** Builds the client every run: a dist/ left from an older checkout would measure code that is no longer there. */
function buildClient() {
  const build = spawnSync('npx', ['vite', 'build'], { cwd: projectRoot, encoding: 'utf8' });
  if (build.status !== 0) throw new Error(`vite build failed: ${build.stderr || build.stdout}`);
}

async function phoneContext(browser: Browser, baseUrl: string, standing: { lon: number; lat: number }, serviceWorkers: 'allow' | 'block') {
  const context = await browser.newContext({ viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true, serviceWorkers });
  await context.grantPermissions(['geolocation'], { origin: baseUrl });
  await context.setGeolocation({ longitude: standing.lon, latitude: standing.lat, accuracy: 5 });
  return context;
}

async function signIn(page: Page, baseUrl: string, email: string) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).tap();
  await page.getByRole('link', { name: 'Walk a field' }).waitFor();
}

/** Milliseconds from navigation until the walk page's pest picker shows. */
async function timeWalkOpen(page: Page, open: () => Promise<unknown>) {
  const started = performance.now();
  await open();
  await page.getByLabel('Pest').waitFor();
  return performance.now() - started;
}

const rowStates = (page: Page) =>
  page
    .getByRole('list', { name: 'Photos in this batch' })
    .getByRole('listitem')
    .evaluateAll((items) => items.map((i) => i.getAttribute('data-upload-state')));

async function until(what: string, timeoutMs: number, done: () => Promise<boolean>) {
  const deadline = Date.now() + timeoutMs;
  while (!(await done())) {
    if (Date.now() > deadline) throw new Error(`${what} did not happen within ${timeoutMs / 1000} s`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

/** The reference: each photo posted from Node as the phone's outbox posts it (one per request, two at a time). */
async function postStraight(baseUrl: string, session: BenchSession, photos: Buffer[], fields: { pestId: string; walkId: string; fieldId: string }) {
  let next = 0;
  let placed = 0;
  const sender = async () => {
    while (next < photos.length) {
      const index = next++;
      const form = new FormData();
      form.append('pestId', fields.pestId);
      form.append('count', '3');
      form.append('walkId', fields.walkId);
      form.append('fieldId', fields.fieldId);
      form.append('clientIds', JSON.stringify([`bench-straight-${index}`]));
      form.append('photos', new Blob([new Uint8Array(photos[index])], { type: 'image/jpeg' }), `straight-${index}.jpg`);
      const res = await fetch(`${baseUrl}/api/photos`, { method: 'POST', headers: { cookie: session.cookie, 'x-csrf-token': session.csrf }, body: form });
      const body = (await res.json()) as { results?: Array<{ outcome: string }> };
      placed += (body.results ?? []).filter((r) => r.outcome === 'placed').length;
    }
  };
  const started = performance.now();
  await Promise.all(Array.from({ length: PARALLEL_SENDS }, sender));
  return { ms: performance.now() - started, placed };
}

/** The drain split into: waiting for the first send, the requests themselves, the phone's own time between them, and the screen catching up. */
function drainTimeline(sends: Array<{ started: number; ended?: number }>, drainStarted: number, drainEnded: number) {
  const done = sends.filter((s): s is { started: number; ended: number } => s.ended !== undefined).sort((a, b) => a.started - b.started);
  if (done.length === 0) return [{ part: 'no photo request seen', ms: '', 'share of drain %': '' }];
  const total = drainEnded - drainStarted;
  const requestMs = done.map((s) => s.ended - s.started);
  // Two sends go at once: the wall time covered by at least one request in flight.
  let covered = 0;
  let reach = -Infinity;
  for (const s of done) {
    const from = Math.max(s.started, reach);
    if (s.ended > from) covered += s.ended - from;
    reach = Math.max(reach, s.ended);
  }
  const firstWait = done[0].started - drainStarted;
  const lastToScreen = drainEnded - Math.max(...done.map((s) => s.ended));
  const row = (part: string, ms: number) => ({ part, ms: fixed(ms), 'share of drain %': fixed((100 * ms) / total) });
  return [
    row('online to the first photo request', firstWait),
    row('a photo request in flight (wall time)', covered),
    row('no request in flight between the first and the last', Math.max(...done.map((s) => s.ended)) - done[0].started - covered),
    row('last answer to every row reading sent', lastToScreen),
    { part: `median photo request (${done.length} requests)`, ms: fixed(median(requestMs)), 'share of drain %': '' },
  ];
}

async function walkCounts(baseUrl: string, session: BenchSession, walkId: string) {
  const res = await fetch(`${baseUrl}/api/walks/${walkId}`, { headers: { cookie: session.cookie } });
  if (!res.ok) throw new Error(`GET /api/walks/${walkId}: ${res.status}`);
  return ((await res.json()) as { walk: { sightingCount: number } }).walk.sightingCount;
}

export async function run(): Promise<BenchTable[]> {
  const photoCount = Number(process.env.BENCH_SCOUT_PHOTOS ?? 50);
  if (!Number.isInteger(photoCount) || photoCount <= 0) throw new Error('BENCH_SCOUT_PHOTOS must be a positive whole number.');
  buildClient();
  const database = await startThrowawayDatabase('scout');
  process.env.WORKERS = 'off'; // thumbnails only queue: the figures are the phone's and the upload's, not the thumbnail threads'
  process.env.LOG_LEVEL ??= 'warn'; // the server runs in this process; its request lines would bury the tables
  let browser: Browser | null = null;
  let close: (() => Promise<void>) | null = null;
  try {
    const { seedDemo } = await import('../seed/seed-demo.ts');
    const { makeJpeg } = await import('../../tests/helpers/photos.ts');
    const { startServer } = await import('../../server/index.ts');
    const { ids } = await seedDemo();
    const points = pointsInsideField('even', photoCount + 1, 'scout-bench');
    const standing = points[photoCount];
    const photos = await Promise.all(
      points.slice(0, photoCount).map((gps, i) =>
        makeJpeg({
          gps: { ...gps, accuracyM: 4 },
          markSeed: 2000 + i,
          width: 640,
          height: 480,
          dateTimeOriginal: '2026:07:22 10:00:00',
          offsetTimeOriginal: '-05:00',
        }),
      ),
    );
    const running = await startServer({ port: 0, host: '127.0.0.1' });
    close = running.close;
    const baseUrl = `http://127.0.0.1:${(running.server.address() as AddressInfo).port}`;
    const scoutEmail = demoUsers.find((u) => u.role === 'scout')!.email;
    const fieldId = ids.fields.even;
    const pestId = ids.pests['Gray leaf spot'];

    browser = await chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: CHROMIUM_ARGS });
    const phone: BrowserContext = await phoneContext(browser, baseUrl, standing, 'allow');
    const page = await phone.newPage();
    await signIn(page, baseUrl, scoutEmail);
    await page.goto(`${baseUrl}/scout/fields/${fieldId}`);
    await page.getByRole('button', { name: 'Start a walk for today' }).tap();
    await page.waitForURL(/\/scout\/walks\/[0-9a-f-]{36}$/);
    const walkUrl = page.url();
    const walkId = walkUrl.split('/').at(-1)!;
    // Once the service worker controls the page, one more open lets it keep the walk's own reads.
    await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
    await page.reload();
    await until('the service worker taking control', 30_000, () => page.evaluate(() => !!navigator.serviceWorker.controller));
    await timeWalkOpen(page, () => page.reload());

    // Reference: the same page from the network, in a context with the same sign-in and no service worker.
    const network = await browser.newContext({
      viewport: { width: 390, height: 844 },
      isMobile: true,
      hasTouch: true,
      serviceWorkers: 'block',
      storageState: await phone.storageState(),
    });
    const networkPage = await network.newPage();
    await timeWalkOpen(networkPage, () => networkPage.goto(walkUrl));
    const fromNetwork: number[] = [];
    for (let i = 0; i < SHELL_OPENS; i++) fromNetwork.push(await timeWalkOpen(networkPage, () => networkPage.reload()));
    await network.close();

    await phone.setOffline(true);
    const fromCache: number[] = [];
    for (let i = 0; i < SHELL_OPENS; i++) fromCache.push(await timeWalkOpen(page, () => page.reload()));

    // Still offline: the scout picks the photos and sends; they wait in the outbox.
    await page.getByLabel('Pest').selectOption(pestId);
    await page.getByLabel('Count for each photo').fill('3');
    await page.getByTestId('gallery-input').setInputFiles(photos.map((buffer, i) => ({ name: `queued-${i}.jpg`, mimeType: 'image/jpeg', buffer })));
    await page.getByRole('button', { name: `Send ${photoCount} photos` }).tap();
    await until(`${photoCount} photos waiting`, 120_000, async () => {
      const states = await rowStates(page);
      return states.length === photoCount && states.every((s) => s === 'waiting');
    });
    // Where the drain's time goes: each photo request's start and end as the browser saw them.
    const sends: Array<{ started: number; ended?: number }> = [];
    const startedAt = new Map<object, number>();
    page.on('request', (request) => {
      if (request.method() === 'POST' && new URL(request.url()).pathname === '/api/photos') startedAt.set(request, performance.now());
    });
    page.on('requestfinished', (request) => {
      const started = startedAt.get(request);
      if (started !== undefined) sends.push({ started, ended: performance.now() });
    });
    const drainStarted = performance.now();
    await phone.setOffline(false);
    await until(`${photoCount} photos sent`, DRAIN_TIMEOUT_MS, async () => (await rowStates(page)).filter((s) => s === 'sent').length === photoCount);
    const drainMs = performance.now() - drainStarted;
    await phone.close();

    const scout = await signInForBench(baseUrl, scoutEmail, DEMO_PASSWORD);
    const placedByPhone = await walkCounts(baseUrl, scout, walkId);
    const straightPhotos = photos.map((p, i) => withComment(p, `straight ${i}`));
    const straight = await postStraight(baseUrl, scout, straightPhotos, { pestId, walkId, fieldId });

    const shellRow = (label: string, ms: number[]) => ({
      'walk page opened': label,
      opens: ms.length,
      'median ms': fixed(median(ms)),
      'max ms': fixed(Math.max(...ms)),
    });
    const drainRow = (label: string, ms: number, placed: number) => ({
      [`${photoCount} photos`]: label,
      placed,
      seconds: fixed(ms / 1000, 1),
      'photos/s': fixed(photoCount / (ms / 1000), 1),
    });
    const timeline = drainTimeline(sends, drainStarted, drainStarted + drainMs);
    return [
      {
        title: 'Scout app shell, phone profile (Chromium)',
        rows: [shellRow('from the service worker cache, offline', fromCache), shellRow('reference: from the network, no service worker', fromNetwork)],
      },
      {
        title: `Outbox drain after the signal returns (${PARALLEL_SENDS} at a time)`,
        rows: [
          drainRow('queued offline on the phone, sent on `online`', drainMs, placedByPhone),
          drainRow('reference: posted straight from Node', straight.ms, straight.placed),
        ],
      },
      { title: 'Where the drain’s time went (as the browser saw each photo request)', rows: timeline },
    ];
  } finally {
    await browser?.close();
    await close?.();
    const { sequelize } = await import('../../server/db.ts');
    await sequelize.close().catch(() => undefined);
    database.dispose();
  }
}
