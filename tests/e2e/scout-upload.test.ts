// A scout on a phone: signs in, starts today's walk, sends three photos (two with GPS, one without),
// pins the third by tapping the field map, sees all three on the walk's map and list, and corrects one count.
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { booleanPointInPolygon } from '@turf/turf';
import { signedIn } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { createFarm, createField, createPest } from '../helpers/farm-records.ts';
import { rectangleBoundary, TEST_FIELD_CORNER } from '../helpers/sightings.ts';
import { makeJpeg } from '../helpers/photos.ts';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { findingsTable, seriousViolations } from '../helpers/accessibility.ts';
import { scoutPhone, signInOnPhone, uploadRows, uploadStates as rowStates } from '../helpers/scout-phone.ts';

const boundary = rectangleBoundary();
// Two points well inside the rectangle, away from its middle where the scout will tap.
const insideA = { lon: TEST_FIELD_CORNER.lon + 0.001, lat: TEST_FIELD_CORNER.lat + 0.0008 };
const insideB = { lon: TEST_FIELD_CORNER.lon + 0.0041, lat: TEST_FIELD_CORNER.lat + 0.0024 };

// Screenshots for a person to look at while developing: SCOUT_SHOTS=/some/folder npm test -- tests/e2e/scout-upload.test.ts
// Uploads, thumbnails and map redraws take a moment on a 2-core machine; wait for the state, never for a time.
const settle = { timeout: 30_000, interval: 200 };
const shotsDir = process.env.SCOUT_SHOTS;
async function shot(page: Page, name: string) {
  if (!shotsDir) return;
  fs.mkdirSync(shotsDir, { recursive: true });
  await page.screenshot({ path: path.join(shotsDir, `${name}.png`), fullPage: true });
}

let server: TestServer;
let baseUrl: string;
let browser: Browser;
let org: TestOrganisation;
let field: { id: string; name: string };
let pest: { id: string; name: string };

beforeAll(async () => {
  // Workers on: the thumbnail job runs, as it would on a real deployment.
  server = await startTestServer({ workers: true });
  baseUrl = server.url;
  browser = await launchBrowser();

  org = await makeOrganisation('Scout upload');
  const admin = await signedIn(org.users.admin.email);
  const farm = await createFarm(admin);
  field = await createField(admin, farm.id, boundary, { name: 'North Forty' });
  pest = await createPest(admin, { countUnit: 'aphids per plant' });
  const assigned = await admin.post(`/api/fields/${field.id}/scouts`, { userId: org.users.scout.id });
  expect(assigned.status).toBe(204);
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

// The service worker is left out here (route interception cannot see what it answers); tests/e2e/scout-offline.test.ts has it.
const phone = () => scoutPhone(browser);

const signInAsScout = (context: BrowserContext) => signInOnPhone(context, baseUrl, org.users.scout.email);

describe('scout on a phone', () => {
  it('uploads three photos, pins the one without GPS, sees all three on the walk, and corrects one count', async () => {
    const photos = [
      { name: 'leaf-a.jpg', mimeType: 'image/jpeg', buffer: await makeJpeg({ gps: insideA, markSeed: 11 }) },
      { name: 'leaf-b.jpg', mimeType: 'image/jpeg', buffer: await makeJpeg({ gps: insideB, markSeed: 22 }) },
      { name: 'leaf-no-gps.jpg', mimeType: 'image/jpeg', buffer: await makeJpeg({ markSeed: 33 }) },
    ];

    const context = await phone();
    try {
      const page = await signInAsScout(context);
      await page.getByRole('link', { name: 'Walk a field' }).tap();
      await page.getByRole('link', { name: /North Forty/ }).tap();
      await shot(page, '1-field');
      await page.getByRole('button', { name: 'Start a walk for today' }).tap();
      await page.waitForURL(/\/scout\/walks\/[0-9a-f-]{36}$/);
      const walkId = page.url().split('/').at(-1)!;

      await page.getByLabel('Pest').selectOption(pest.id);
      await page.getByLabel('Count for each photo').fill('4');
      await page.getByTestId('gallery-input').setInputFiles(photos);
      await shot(page, '2-ready');
      await page.getByRole('button', { name: 'Send 3 photos' }).tap();

      const rows = uploadRows(page);
      await expect.poll(() => rowStates(page), settle).toEqual(['sent', 'sent', 'sent']);
      expect(await rows.evaluateAll((items) => items.map((i) => i.getAttribute('data-outcome')))).toEqual(['placed', 'placed', 'needs-pin']);
      await expect.poll(() => rows.nth(0).textContent(), settle).toContain('Placed in North Forty');
      await shot(page, '3-sent');
      // axe-core (Deque) finds nothing serious on the walk page with its outcomes showing.
      expect(findingsTable(await seriousViolations(page))).toBe('(none)');

      await page.getByRole('link', { name: 'Pin it on the map' }).tap();
      const pinMap = page.getByRole('region', { name: /tap where the photo was taken/ });
      await pinMap.locator('.leaflet-container').waitFor();
      await page.waitForTimeout(300); // let fitBounds settle before the tap
      // The middle of the map: fitBounds centres the field there, so the tap lands inside the boundary.
      const mapArea = pinMap.locator('.leaflet-container');
      const box = (await mapArea.boundingBox())!;
      await mapArea.tap({ position: { x: box.width / 2, y: box.height / 2 } });
      await expect.poll(() => pinMap.locator('path.pin-choice').count(), settle).toBe(1);
      await shot(page, '4-pin');
      expect(findingsTable(await seriousViolations(page))).toBe('(none)');
      await page.getByRole('button', { name: 'Confirm this place' }).tap();

      await page.waitForURL(new RegExp(`/scout/walks/${walkId}$`));
      const walkMap = page.getByRole('region', { name: /with this walk’s sightings/ });
      await expect.poll(() => walkMap.locator('path.sighting-marker').count(), settle).toBe(3);
      const list = page.getByRole('list', { name: 'Sightings on this walk' }).getByRole('listitem');
      await expect.poll(() => list.count(), settle).toBe(3);
      const sources = await list.evaluateAll((items) => items.map((i) => i.getAttribute('data-position-source')).sort());
      expect(sources).toEqual(['exif', 'exif', 'pin']);
      expect(await list.filter({ hasText: 'pinned by hand' }).count()).toBe(1);
      expect(await list.filter({ hasText: 'from photo GPS' }).count()).toBe(2);
      await expect.poll(() => rows.nth(2).textContent(), settle).toContain('Pinned by hand in North Forty');
      // The thumbnails arrive from the background job; the walk asks again until they are there.
      const loadedThumbnails = () =>
        list.locator('img').evaluateAll((imgs) => imgs.filter((i) => (i as HTMLImageElement).complete && (i as HTMLImageElement).naturalWidth > 0).length);
      await expect.poll(loadedThumbnails, { timeout: 60_000, interval: 500 }).toBe(3);
      await shot(page, '5-walk');

      // What the server stored: the pinned one lies inside the field (turf as the outside judge).
      const scout = await signedIn(org.users.scout.email);
      const detail = (await scout.get(`/api/walks/${walkId}`).expect(200)).body as {
        sightings: Array<{ status: string; positionSource: string; position: { lon: number; lat: number } | null; count: number | null }>;
      };
      const pinned = detail.sightings.find((s) => s.positionSource === 'pin')!;
      expect(pinned.status).toBe('placed');
      expect(booleanPointInPolygon([pinned.position!.lon, pinned.position!.lat], boundary)).toBe(true);
      expect(detail.sightings.map((s) => s.count)).toEqual([4, 4, 4]);

      // The scout corrects the pinned photo's count from the list: the list shows it, and the server keeps it.
      const pinnedRow = list.filter({ hasText: 'pinned by hand' });
      await pinnedRow.getByRole('button', { name: /^Correct the sighting/ }).tap();
      const correction = page.getByRole('form', { name: /^Correct the sighting/ });
      await correction.getByLabel('Count').fill('7');
      await shot(page, '6-correct');
      await correction.getByRole('button', { name: 'Save the correction' }).tap();
      await correction.waitFor({ state: 'detached' });
      await expect.poll(() => pinnedRow.getByTestId('sighting-count').textContent(), settle).toBe('Count 7');
      const corrected = (await scout.get(`/api/walks/${walkId}`).expect(200)).body as typeof detail;
      expect(corrected.sightings.find((s) => s.positionSource === 'pin')!.count).toBe(7);
      expect(corrected.sightings.filter((s) => s.positionSource === 'exif').map((s) => s.count)).toEqual([4, 4]);
    } finally {
      await context.close();
    }
  });

  it('sends a photo again alone after its connection dropped, keeps what was sent over a reload, and never doubles a photo', async () => {
    const admin = await signedIn(org.users.admin.email);
    const farm = await createFarm(admin);
    const other = await createField(admin, farm.id, boundary, { name: 'South Forty' });
    await admin.post(`/api/fields/${other.id}/scouts`, { userId: org.users.scout.id }).expect(204);
    const steady = { name: 'steady.jpg', mimeType: 'image/jpeg', buffer: await makeJpeg({ gps: insideA, markSeed: 44 }) };
    const shaky = { name: 'shaky.jpg', mimeType: 'image/jpeg', buffer: await makeJpeg({ gps: insideB, markSeed: 55 }) };

    const context = await phone();
    try {
      const page = await signInAsScout(context);
      await page.goto(`${baseUrl}/scout/fields/${other.id}`);
      await page.getByRole('button', { name: 'Start a walk for today' }).tap();
      await page.waitForURL(/\/scout\/walks\/[0-9a-f-]{36}$/);
      const walkId = page.url().split('/').at(-1)!;

      // The phone loses its signal while one photo is on its way (Chromium's own network error).
      let signal = false;
      await page.route('**/api/photos', (route) => {
        const shakyOnItsWay = route.request().postDataBuffer()?.includes('filename="shaky.jpg"');
        return shakyOnItsWay && !signal ? route.abort('internetdisconnected') : route.continue();
      });
      await page.getByLabel('Pest').selectOption(pest.id);
      await page.getByTestId('gallery-input').setInputFiles([steady, shaky]);
      await page.getByRole('button', { name: 'Send 2 photos' }).tap();
      // The dropped photo waits on the phone with the reason, to go again by itself or at a tap.
      await expect.poll(() => rowStates(page), settle).toEqual(['sent', 'waiting']);
      const shakyRow = uploadRows(page).nth(1);
      expect(await shakyRow.textContent()).toContain('The connection dropped');
      // The waiting photo shows a small preview the phone made (160 px wide, photo-preview.ts), decoded and drawn.
      const decodedWidth = (row: ReturnType<typeof uploadRows>) =>
        row.getByRole('img', { name: /^Preview of / }).evaluate((img: HTMLImageElement) => (img.complete ? img.naturalWidth : 0));
      await expect.poll(() => decodedWidth(shakyRow), settle).toBe(160);
      const steadyPreview = uploadRows(page).nth(0).getByRole('img', { name: 'Preview of steady.jpg' });
      const steadyPreviewUrl = await steadyPreview.getAttribute('src');
      await shot(page, '6-dropped');

      signal = true;
      await shakyRow.getByRole('button', { name: 'Send now' }).tap();
      await expect.poll(() => rowStates(page), settle).toEqual(['sent', 'sent']);
      // The other row kept its preview while the outbox changed around it: no new image made and decoded for it.
      expect(await steadyPreview.getAttribute('src')).toBe(steadyPreviewUrl);
      expect(await uploadRows(page).evaluateAll((items) => items.map((i) => i.getAttribute('data-outcome')))).toEqual(['placed', 'placed']);

      await page.reload();
      await expect.poll(() => rowStates(page), settle).toEqual(['sent', 'sent']);
      // The previews were kept on the phone with the photos: they are back after the reload.
      await expect.poll(() => decodedWidth(uploadRows(page).nth(1)), settle).toBe(160);

      // Sending the same photo again is harmless: the server recognises it.
      await page.getByLabel('Pest').selectOption(pest.id);
      await page.getByTestId('gallery-input').setInputFiles([shaky]);
      await page.getByRole('button', { name: 'Send 1 photo' }).tap();
      await expect.poll(() => uploadRows(page).nth(2).getAttribute('data-outcome'), settle).toBe('duplicate');

      const scout = await signedIn(org.users.scout.email);
      const detail = (await scout.get(`/api/walks/${walkId}`).expect(200)).body as { sightings: unknown[] };
      expect(detail.sightings).toHaveLength(2);
    } finally {
      await context.close();
    }
  });

  it('records an empty stop at the phone’s position, and says plainly when location is refused', async () => {
    const admin = await signedIn(org.users.admin.email);
    const farm = await createFarm(admin);
    const meadow = await createField(admin, farm.id, boundary, { name: 'Creek Meadow' });
    await admin.post(`/api/fields/${meadow.id}/scouts`, { userId: org.users.scout.id }).expect(204);

    const context = await phone();
    try {
      const page = await signInAsScout(context);
      await page.goto(`${baseUrl}/scout/fields/${meadow.id}`);
      await page.getByRole('button', { name: 'Start a walk for today' }).tap();
      await page.waitForURL(/\/scout\/walks\/[0-9a-f-]{36}$/);
      const walkId = page.url().split('/').at(-1)!;
      await page.getByLabel('Pest').selectOption(pest.id);

      // No permission granted yet: the browser refuses, and the scout is told what to do.
      await page.getByRole('button', { name: 'Nothing found here' }).tap();
      await expect.poll(() => page.getByText('Allow location for this site').count(), settle).toBe(1);

      await context.grantPermissions(['geolocation'], { origin: baseUrl });
      await context.setGeolocation({ longitude: insideB.lon, latitude: insideB.lat, accuracy: 6 });
      await page.getByRole('button', { name: 'Nothing found here' }).tap();
      await expect.poll(() => page.getByText(/Stop recorded: .* within ±6 m/).count(), settle).toBe(1);
      const walkMap = page.getByRole('region', { name: /with this walk’s sightings/ });
      await expect.poll(() => walkMap.locator('path.sighting-marker.empty-stop').count(), settle).toBe(1);
      await shot(page, '7-stop');

      const scout = await signedIn(org.users.scout.email);
      const detail = (await scout.get(`/api/walks/${walkId}`).expect(200)).body as {
        sightings: Array<{
          isEmptyStop: boolean;
          count: number | null;
          positionSource: string;
          accuracyM: number | null;
          position: { lon: number; lat: number };
        }>;
      };
      expect(detail.sightings).toHaveLength(1);
      const [stop] = detail.sightings;
      expect(stop).toMatchObject({ isEmptyStop: true, count: 0, positionSource: 'device', accuracyM: 6 });
      expect(stop.position.lon).toBeCloseTo(insideB.lon, 9);
      expect(stop.position.lat).toBeCloseTo(insideB.lat, 9);
    } finally {
      await context.close();
    }
  });

  it('just uploads: Patchwise finds the field and the day’s walk from the photo’s GPS', async () => {
    const admin = await signedIn(org.users.admin.email);
    const farm = await createFarm(admin);
    // A field of its own, east of the others, so the photo's position can only mean this one.
    const eastCorner = { lon: TEST_FIELD_CORNER.lon + 0.02, lat: TEST_FIELD_CORNER.lat };
    const east = await createField(admin, farm.id, rectangleBoundary(eastCorner), { name: 'East Quarter' });
    await admin.post(`/api/fields/${east.id}/scouts`, { userId: org.users.scout.id }).expect(204);
    const photo = {
      name: 'found-it.jpg',
      mimeType: 'image/jpeg',
      buffer: await makeJpeg({ gps: { lon: eastCorner.lon + 0.002, lat: eastCorner.lat + 0.001 }, markSeed: 66 }),
    };

    const context = await phone();
    try {
      const page = await signInAsScout(context);
      await page.getByRole('link', { name: 'Just upload' }).tap();
      await page.getByLabel('Pest').selectOption(pest.id);
      await page.getByTestId('gallery-input').setInputFiles([photo]);
      await page.getByRole('button', { name: 'Send 1 photo' }).tap();
      await expect.poll(() => uploadRows(page).first().textContent(), settle).toContain('Placed in East Quarter');
      await shot(page, '8-just-upload');

      await page.getByRole('link', { name: 'Open the walk' }).tap();
      await page.waitForURL(/\/scout\/walks\/[0-9a-f-]{36}$/);
      await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent(), settle).toBe('East Quarter');
      const list = page.getByRole('list', { name: 'Sightings on this walk' }).getByRole('listitem');
      await expect.poll(() => list.count(), settle).toBe(1);
    } finally {
      await context.close();
    }
  });
});
