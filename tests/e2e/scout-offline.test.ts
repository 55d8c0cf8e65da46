// A scout in a field without signal, on a phone: the walk opens from the service worker's cache, photos and an empty
// stop recorded offline wait on the phone through a reload, and each is placed exactly once when the signal returns.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { createFarm, createField, createPest } from '../helpers/farm-records.ts';
import { rectangleBoundary, TEST_FIELD_CORNER } from '../helpers/sightings.ts';
import { makeJpeg } from '../helpers/photos.ts';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { scoutPhone, signInOnPhone, startTodaysWalk, uploadRows, uploadStates as rowStates } from '../helpers/scout-phone.ts';

const boundary = rectangleBoundary();
const insideA = { lon: TEST_FIELD_CORNER.lon + 0.001, lat: TEST_FIELD_CORNER.lat + 0.0008 };
const insideB = { lon: TEST_FIELD_CORNER.lon + 0.0041, lat: TEST_FIELD_CORNER.lat + 0.0024 };
const standing = { longitude: TEST_FIELD_CORNER.lon + 0.0025, latitude: TEST_FIELD_CORNER.lat + 0.0015, accuracy: 5 };
const settle = { timeout: 30_000, interval: 200 };

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let pest: { id: string; name: string };

beforeAll(async () => {
  server = await startTestServer();
  browser = await launchBrowser();
  org = await makeOrganisation('Scout offline');
  const admin = await signedIn(org.users.admin.email);
  pest = await createPest(admin, { countUnit: 'aphids per plant' });
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function assignedField(name: string) {
  const admin = await signedIn(org.users.admin.email);
  const farm = await createFarm(admin);
  const field = await createField(admin, farm.id, boundary, { name });
  await admin.post(`/api/fields/${field.id}/scouts`, { userId: org.users.scout.id }).expect(204);
  return field;
}

// The service worker runs here: these journeys open the scout's pages from its cache.
const phone = () => scoutPhone(browser, { serviceWorkers: 'allow', position: standing, origin: server.url });

async function startWalk(context: BrowserContext, fieldId: string): Promise<{ page: Page; walkId: string }> {
  const page = await signInOnPhone(context, server.url, org.users.scout.email);
  return { page, walkId: await startTodaysWalk(page, server.url, fieldId) };
}
const stopStates = (page: Page) =>
  page
    .getByRole('list', { name: 'Stops kept on this phone' })
    .getByRole('listitem')
    .evaluateAll((items) => items.map((i) => i.getAttribute('data-stop-state')));

// One API session for the file: the sign-in limiter counts every sign-in of the scout, the browser's among them.
let scoutSession: Promise<Awaited<ReturnType<typeof signedIn>>> | undefined;
const scoutClient = () => (scoutSession ??= signedIn(org.users.scout.email));

async function walkOnServer(walkId: string) {
  const scout = await scoutClient();
  return (await scout.get(`/api/walks/${walkId}`).expect(200)).body as {
    walk: { sightingCount: number; stopCount: number };
    sightings: Array<{ isEmptyStop: boolean; positionSource: string }>;
  };
}

/** Opens the field's page online until the service worker runs it, so the page and the field's reads are kept. */
async function openFieldForOffline(context: BrowserContext, fieldId: string): Promise<Page> {
  const page = await signInOnPhone(context, server.url, org.users.scout.email);
  await page.goto(`${server.url}/scout/fields/${fieldId}`);
  await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
  await expect.poll(() => page.evaluate(() => !!navigator.serviceWorker.controller), settle).toBe(true);
  await page.reload();
  await page.getByRole('button', { name: 'Start a walk for today' }).waitFor();
  // The field page reads the pest library the walk page needs, so the service worker keeps it.
  await expect
    .poll(() => page.evaluate(async () => !!(await caches.open('patchwise-scout-api').then((c) => c.match('/api/pests?includeInactive=false')))), settle)
    .toBe(true);
  return page;
}

async function recordPhotoAndStop(page: Page, markSeed: number) {
  await page.getByLabel('Pest').selectOption(pest.id);
  await page.getByLabel('Count for each photo').fill('3');
  await page
    .getByTestId('gallery-input')
    .setInputFiles([{ name: `gully-${markSeed}.jpg`, mimeType: 'image/jpeg', buffer: await makeJpeg({ gps: insideA, markSeed }) }]);
  await page.getByRole('button', { name: 'Send 1 photo' }).tap();
  await expect.poll(() => rowStates(page), settle).toEqual(['waiting']);
  await page.getByRole('button', { name: 'Nothing found here' }).tap();
  await expect.poll(() => stopStates(page), settle).toEqual(['waiting']);
}

/** Today on the phone's calendar; the browser and this process share the machine's time zone. */
function phoneToday() {
  const now = new Date();
  return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
}

async function walksOfField(fieldId: string) {
  const scout = await scoutClient();
  return (await scout.get(`/api/walks?fieldId=${fieldId}`).expect(200)).body.walks as Array<{ id: string; sightingCount: number; stopCount: number }>;
}

describe('scout without signal', () => {
  it('keeps photos and a stop recorded offline through a reload, and places each exactly once when the signal returns', async () => {
    const field = await assignedField('Far Paddock');
    const context = await phone();
    try {
      const { page, walkId } = await startWalk(context, field.id);
      // Once the service worker runs the page, a reload lets it keep the walk's own reads for later.
      await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined));
      await page.reload();
      await page.getByLabel('Pest').waitFor();
      await expect.poll(() => page.evaluate(() => !!navigator.serviceWorker.controller), settle).toBe(true);
      await page.reload();
      await page.getByLabel('Pest').waitFor();

      await context.setOffline(true);
      // Headless Chromium's emulated position must be set again once the field list's watch has ended.
      await context.setGeolocation(standing);
      await page.getByLabel('Pest').selectOption(pest.id);
      await page.getByLabel('Count for each photo').fill('3');
      await page.getByTestId('gallery-input').setInputFiles([
        { name: 'offline-a.jpg', mimeType: 'image/jpeg', buffer: await makeJpeg({ gps: insideA, markSeed: 61 }) },
        { name: 'offline-b.jpg', mimeType: 'image/jpeg', buffer: await makeJpeg({ gps: insideB, markSeed: 62 }) },
      ]);
      await page.getByRole('button', { name: 'Send 2 photos' }).tap();
      await expect.poll(() => rowStates(page), settle).toEqual(['waiting', 'waiting']);
      await page.getByRole('button', { name: 'Nothing found here' }).tap();
      const stopStatus = page.getByRole('button', { name: 'Nothing found here' }).locator('xpath=following-sibling::p[@role="status"]');
      await expect.poll(() => stopStatus.textContent(), settle).toMatch(/kept on this phone until there is signal/);
      await expect.poll(() => stopStates(page), settle).toEqual(['waiting']);
      const banner = page.getByTestId('outbox-banner');
      await expect.poll(() => banner.textContent(), settle).toMatch(/offline.*3 items wait on this phone/);
      // Each waiting photo shows the preview made on the phone, and the map shows what waits.
      const previews = uploadRows(page).locator('img');
      await expect.poll(() => previews.evaluateAll((imgs) => imgs.filter((i) => (i as HTMLImageElement).naturalWidth > 0).length), settle).toBe(2);
      await expect.poll(() => page.locator('path.queued-marker').count(), settle).toBe(3);
      await expect.poll(() => page.locator('path.you-are-here').count(), settle).toBe(1);

      // Still without signal, the page reloads from the phone: the shell, the walk and the outbox are all there.
      await page.reload();
      await page.getByLabel('Pest').waitFor();
      await expect.poll(() => rowStates(page), settle).toEqual(['waiting', 'waiting']);
      await expect.poll(() => stopStates(page), settle).toEqual(['waiting']);
      expect((await walkOnServer(walkId)).sightings).toHaveLength(0);

      await context.setOffline(false);
      await expect.poll(() => rowStates(page), settle).toEqual(['sent', 'sent']);
      await expect.poll(() => stopStates(page), settle).toEqual([]);

      // Standing inside the field (every test field shares one rectangle), the field list says so and puts it first.
      await page.getByRole('link', { name: 'Walk a field' }).tap();
      await expect.poll(() => page.getByText(/^You are in /).count(), settle).toBe(1);
      const first = page.getByRole('list', { name: 'Fields assigned to you' }).getByRole('listitem').first();
      expect(await first.textContent()).toContain('you are in it');
      const stored = await walkOnServer(walkId);
      expect(stored.walk).toMatchObject({ sightingCount: 2, stopCount: 1 });
      expect(stored.sightings.filter((s) => s.isEmptyStop)).toHaveLength(1);
      await expect.poll(() => banner.count(), settle).toBe(0);
    } finally {
      await context.close();
    }
  });

  it('starts today’s walk without signal, and the walk, its photo and its stop each reach the server once', async () => {
    const field = await assignedField('Dry Gully');
    const context = await phone();
    try {
      const page = await openFieldForOffline(context, field.id);
      await context.setOffline(true);
      await context.setGeolocation(standing);
      await page.reload();
      await page.getByRole('button', { name: 'Start a walk for today' }).tap();
      await page.waitForURL(/\/scout\/walks\/[0-9a-f-]{36}$/);
      const phoneWalkId = page.url().split('/').at(-1)!;
      await page.getByText(/Started on this phone without signal/).waitFor();
      await recordPhotoAndStop(page, 81);

      // Reopened without signal, the walk comes from the phone with what waits for it.
      await page.reload();
      await page.getByText(/Started on this phone without signal/).waitFor();
      await expect.poll(() => rowStates(page), settle).toEqual(['waiting']);
      await expect.poll(() => stopStates(page), settle).toEqual(['waiting']);

      await context.setOffline(false);
      await expect.poll(() => rowStates(page), settle).toEqual(['sent']);
      await expect.poll(() => stopStates(page), settle).toEqual([]);
      await expect.poll(() => page.getByText(/Started on this phone without signal/).count(), settle).toBe(0);
      const walks = await walksOfField(field.id);
      expect(walks).toHaveLength(1);
      expect(walks[0]).toMatchObject({ id: phoneWalkId, sightingCount: 1, stopCount: 1 });
    } finally {
      await context.close();
    }
  });

  it('puts what was kept for a walk started offline into the walk the scout had already started there that day', async () => {
    const field = await assignedField('Mill Corner');
    const context = await phone();
    try {
      const page = await openFieldForOffline(context, field.id);
      await context.setOffline(true);
      await context.setGeolocation(standing);
      await page.reload();
      await page.getByRole('button', { name: 'Start a walk for today' }).tap();
      await page.waitForURL(/\/scout\/walks\/[0-9a-f-]{36}$/);
      await recordPhotoAndStop(page, 91);
      // Meanwhile the same scout started today's walk on this field from another phone.
      const scout = await scoutClient();
      const elsewhere = (await scout.post('/api/walks', { fieldId: field.id, walkedOn: phoneToday() }).expect(201)).body.walk.id as string;

      await context.setOffline(false);
      await page.waitForURL(new RegExp(`/scout/walks/${elsewhere}$`), { timeout: 30_000 });
      await expect.poll(() => rowStates(page), settle).toEqual(['sent']);
      await expect.poll(() => stopStates(page), settle).toEqual([]);
      const walks = await walksOfField(field.id);
      expect(walks).toHaveLength(1);
      expect(walks[0]).toMatchObject({ id: elsewhere, sightingCount: 1, stopCount: 1 });
    } finally {
      await context.close();
    }
  });

  it('sends again a photo whose connection dropped mid-send, by itself, and records it once', async () => {
    const field = await assignedField('Long Acre');
    // Route interception sees only what no service worker answers.
    const context = await scoutPhone(browser);
    try {
      const { page, walkId } = await startWalk(context, field.id);
      let dropped = 0;
      await page.route('**/api/photos', async (route) => {
        if (dropped++ === 0) {
          // The request reaches the server, but its answer never comes back to the phone.
          await route.fetch();
          return route.abort('connectionreset');
        }
        return route.continue();
      });
      await page.getByLabel('Pest').selectOption(pest.id);
      await page
        .getByTestId('gallery-input')
        .setInputFiles([{ name: 'shaky.jpg', mimeType: 'image/jpeg', buffer: await makeJpeg({ gps: insideA, markSeed: 71 }) }]);
      await page.getByRole('button', { name: 'Send 1 photo' }).tap();
      await expect.poll(() => rowStates(page), settle).toEqual(['waiting']);
      // The retry comes by itself a few seconds later; the server knows the photo by its content.
      await expect.poll(() => rowStates(page), settle).toEqual(['sent']);
      expect(dropped).toBe(2);
      const stored = await walkOnServer(walkId);
      expect(stored.sightings).toHaveLength(1);
    } finally {
      await context.close();
    }
  });

  it('shows a queued file the server refuses with its sentence, and places the other queued items exactly once', async () => {
    const field = await assignedField('Wet Corner');
    const context = await phone();
    try {
      const { page, walkId } = await startWalk(context, field.id);
      // The walk page and its pest list are on the phone before the signal goes.
      await page.getByLabel('Pest').waitFor();
      await context.setOffline(true);
      await context.setGeolocation(standing);
      await page.getByLabel('Pest').selectOption(pest.id);
      await page.getByLabel('Count for each photo').fill('2');
      // The third file is text under a photo's name; the server reads its bytes, not its name (server/services/photo-type.ts).
      await page.getByTestId('gallery-input').setInputFiles([
        { name: 'queued-a.jpg', mimeType: 'image/jpeg', buffer: await makeJpeg({ gps: insideA, markSeed: 91 }) },
        { name: 'queued-b.jpg', mimeType: 'image/jpeg', buffer: await makeJpeg({ gps: insideB, markSeed: 92 }) },
        { name: 'field-notes.jpg', mimeType: 'image/jpeg', buffer: Buffer.from('Row 12: curled leaves, check again Friday.\n') },
      ]);
      await page.getByRole('button', { name: 'Send 3 photos' }).tap();
      await page.getByRole('button', { name: 'Nothing found here' }).tap();
      await expect.poll(() => rowStates(page), settle).toEqual(['waiting', 'waiting', 'waiting']);
      await expect.poll(() => stopStates(page), settle).toEqual(['waiting']);

      await context.setOffline(false);
      const byName = () =>
        uploadRows(page).evaluateAll((items) =>
          Object.fromEntries(items.map((i) => [i.querySelector('p')?.textContent ?? '', i.getAttribute('data-upload-state')])),
        );
      await expect.poll(byName, settle).toEqual({ 'queued-a.jpg': 'sent', 'queued-b.jpg': 'sent', 'field-notes.jpg': 'refused' });
      await expect.poll(() => stopStates(page), settle).toEqual([]);
      const refused = uploadRows(page).filter({ hasText: 'field-notes.jpg' });
      expect(await refused.textContent()).toMatch(/Not accepted.*This file is not a recognisable image, whatever its name says/);
      expect(await refused.getByRole('button', { name: 'Remove field-notes.jpg' }).isVisible()).toBe(true);
      // Nothing waits any more; the banner points to the refused file instead.
      await expect.poll(() => page.getByTestId('outbox-banner').textContent(), settle).toBe('1 item was not accepted: see the walk for the reason.');

      // Another pass of the outbox (a reload sends what waits) leaves the refused file alone and doubles nothing.
      await page.reload();
      await expect.poll(byName, settle).toEqual({ 'queued-a.jpg': 'sent', 'queued-b.jpg': 'sent', 'field-notes.jpg': 'refused' });
      const stored = await walkOnServer(walkId);
      expect(stored.walk).toMatchObject({ sightingCount: 2, stopCount: 1 });
      expect(stored.sightings).toHaveLength(3);
    } finally {
      await context.close();
    }
  });

  it('shows the server’s reason on a stop it refused, and keeps it on the phone until the scout removes it', async () => {
    const field = await assignedField('Stony Rise');
    const context = await phone();
    try {
      const { page, walkId } = await startWalk(context, field.id);
      await context.setGeolocation({ longitude: TEST_FIELD_CORNER.lon - 0.01, latitude: TEST_FIELD_CORNER.lat - 0.01, accuracy: 5 });
      await page.getByLabel('Pest').selectOption(pest.id);
      await page.getByRole('button', { name: 'Nothing found here' }).tap();
      await expect.poll(() => stopStates(page), settle).toEqual(['refused']);
      const refused = page.getByRole('list', { name: 'Stops kept on this phone' }).getByRole('listitem');
      expect(await refused.textContent()).toMatch(/outside Stony Rise; walk into the field/);
      await page.reload();
      await expect.poll(() => stopStates(page), settle).toEqual(['refused']);
      await refused.getByRole('button', { name: 'Remove this stop' }).tap();
      await expect.poll(() => stopStates(page), settle).toEqual([]);
      expect((await walkOnServer(walkId)).sightings).toHaveLength(0);
    } finally {
      await context.close();
    }
  });
});
