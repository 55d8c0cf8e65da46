// A scout sends a photo while the server's photo storage does not answer: the phone keeps it waiting (not refused),
// tries again by itself, and once storage is back the photo is placed exactly once.
import { vi, afterAll, beforeAll, describe, expect, it } from 'vitest';

const outage = await vi.hoisted(async () => {
  const { objectStoreOutage } = await import('../helpers/object-store-outage.ts');
  const made = await objectStoreOutage();
  // Before the test server reads its configuration: the S3 driver, pointed at a port nothing listens on yet.
  process.env.STORAGE_URL = made.storageUrl;
  Object.assign(process.env, made.credentials);
  return made;
});

import type { Browser, Request } from 'playwright-core';
import { signedIn } from '../helpers/http.ts';
import type { TestOrganisation } from '../helpers/org.ts';
import { organisationWithAssignedField } from '../helpers/assigned-field.ts';
import { TEST_FIELD_CORNER } from '../helpers/sightings.ts';
import { makeJpeg } from '../helpers/photos.ts';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { scoutPhone, signInOnPhone, startTodaysWalk, uploadRows, uploadStates as rowStates } from '../helpers/scout-phone.ts';

const settle = { timeout: 45_000, interval: 200 };
const inside = { lon: TEST_FIELD_CORNER.lon + 0.002, lat: TEST_FIELD_CORNER.lat + 0.001 };

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let pest: { id: string; name: string };
let fieldId: string;

beforeAll(async () => {
  server = await startTestServer();
  browser = await launchBrowser();
  ({ org, pest, fieldId } = await organisationWithAssignedField('Scout storage outage', 'Sluice Meadow'));
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
  await outage.close();
});

describe('scout sending a photo while storage is down', () => {
  it('keeps the photo waiting, sends it again by itself, and places it once after storage is back', async () => {
    // No service worker, so every upload the page makes is seen and counted here.
    const context = await scoutPhone(browser);
    try {
      const page = await signInOnPhone(context, server.url, org.users.scout.email);
      const walkId = await startTodaysWalk(page, server.url, fieldId);
      // Counted once each attempt's answer is back: while a request is still out the row says "sending", so reading the
      // row between attempts needs the attempt to have ended, not merely begun.
      let uploadsAnswered = 0;
      const countAnswered = (request: Request) => {
        if (request.method() === 'POST' && new URL(request.url()).pathname === '/api/photos') uploadsAnswered++;
      };
      page.on('requestfinished', countAnswered);
      page.on('requestfailed', countAnswered);

      await page.getByLabel('Pest').selectOption(pest.id);
      await page
        .getByTestId('gallery-input')
        .setInputFiles([{ name: 'sluice.jpg', mimeType: 'image/jpeg', buffer: await makeJpeg({ gps: inside, markSeed: 151 }) }]);
      await page.getByRole('button', { name: 'Send 1 photo' }).tap();
      await expect.poll(() => uploadRows(page).textContent(), settle).toMatch(/could not save this photo just now/);
      await expect.poll(() => rowStates(page), settle).toEqual(['waiting']);
      // The phone tries again by itself; the photo still waits, never marked refused.
      await expect.poll(() => uploadsAnswered, settle).toBeGreaterThanOrEqual(2);
      await expect.poll(() => rowStates(page), settle).toEqual(['waiting']);
      const scout = await signedIn(org.users.scout.email);
      expect((await scout.get(`/api/walks/${walkId}`).expect(200)).body.sightings).toHaveLength(0);

      await outage.restore();
      await expect.poll(() => rowStates(page), settle).toEqual(['sent']);
      const stored = (await scout.get(`/api/walks/${walkId}`).expect(200)).body;
      expect(stored.sightings).toHaveLength(1);
      expect(stored.walk.sightingCount).toBe(1);
    } finally {
      await context.close();
    }
  });
});
