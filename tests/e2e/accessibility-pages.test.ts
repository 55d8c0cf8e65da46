// Accessibility of every signed-in page: one row per page of src/app/routes.tsx (each role's home and every app
// route) says how to open a real instance of it; each row's page has no serious or critical axe-core finding
// (axe-core 4.10's default rules, its own impact levels), Tab reaches every control in document order, and the
// page's main job is done with the keyboard alone. A page of the route table with no row fails the first test.
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { booleanPointInPolygon } from '@turf/turf';
import type { Role } from '../../shared/schemas/roles.ts';
import type { SightingView } from '../../shared/schemas/sightings.ts';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { createFarm, createField, createPest } from '../helpers/farm-records.ts';
import { rectangleBoundary, TEST_FIELD_CORNER } from '../helpers/sightings.ts';
import { acceptProposedZones, addContacts, linkGrower, makeCheckedField, type ScoutedCheck } from '../helpers/zones.ts';
import { waitForMessage } from '../helpers/mailbox.ts';
import { makeJpeg, uploadPhotos } from '../helpers/photos.ts';
import { findingsTable, focusTop, seriousViolations, tabTo } from '../helpers/accessibility.ts';
import { expectAccessible, newContext, PHONE_POSITION, sendOnePhotoByKeyboard, signInByKeyboard, type Device } from '../helpers/accessibility-browser.ts';
import { coverageGaps, homePage, rolesOf } from '../helpers/accessibility-pages.ts';

interface World {
  org: TestOrganisation;
  admin: Client;
  scout: Client;
  /** The scout's field (assigned to them), with today's walk and a photo on it that carries no GPS. */
  walkedField: { id: string; name: string };
  walkId: string;
  needsPinId: string;
  /** A checked field with accepted zones, a sent notice (to the grower's own account) and a draft. */
  noticed: ScoutedCheck;
  zoneSetId: string;
  sentNoticeId: string;
  draftNoticeId: string;
  mailMessageId: number;
  /** A checked field with no zones yet, for the zone editor. */
  unzoned: ScoutedCheck;
}

interface PageRow {
  /** The page as src/app/routes.tsx names it (homes as "/ (role home)"). */
  page: string;
  role: Role;
  device: Device;
  /** The address of a real instance of the page. */
  url: (w: World) => string;
  /** Resolves once the page shows its content (not its loading state). */
  ready: (page: Page, w: World) => Promise<unknown>;
  /** The page's main job, done with the keyboard alone and checked on screen (and, where it stores something, on the server). */
  keyboard?: { does: string; run: (page: Page, w: World) => Promise<void> };
}

const settle = { timeout: 60_000, interval: 250 };
const RECOMMENDATION = 'Spot-treat the two zones only, following the product label; re-scout the whole field in seven days.';
// Inside the invented test field (tests/helpers/sightings.ts: 0.005° of longitude by 0.003° of latitude from its corner).
const TYPED_PIN = { lat: TEST_FIELD_CORNER.lat + 0.002, lon: TEST_FIELD_CORNER.lon + 0.001 };

/** Enter on a control reached by Tab from the top of the page. */
async function pressOn(page: Page, target: ReturnType<Page['getByRole']>, key = 'Enter') {
  await focusTop(page);
  await tabTo(page, target);
  await page.keyboard.press(key);
}

/** Types into a text box reached by Tab, replacing what it held. */
async function typeInto(page: Page, box: ReturnType<Page['getByLabel']>, text: string) {
  await tabTo(page, box);
  await page.keyboard.press('ControlOrMeta+a');
  await page.keyboard.type(text);
}

const main = (page: Page) => page.getByRole('main');

// The signed-in pages that tests/e2e/accessibility.test.ts already checks the same way, with its test's name.
const coveredInAccessibilityTest: Array<{ page: string; test: string }> = [
  { page: '/fields/:fieldId', test: 'admin farms and fields pages' },
  { page: '/admin/farms', test: 'admin farms and fields pages' },
  { page: '/admin/farms/:farmId', test: 'admin farms and fields pages' },
  { page: '/admin/farms/:farmId/fields/new', test: 'admin farms and fields pages' },
  { page: '/fields/:fieldId/review', test: 'adviser field review' },
  { page: '/scout/walks/:walkId', test: 'scout walk page on a phone' },
];

const rows: PageRow[] = [
  // --- Homes ---
  {
    page: homePage('admin'),
    role: 'admin',
    device: 'desk',
    url: () => '/',
    ready: (page) =>
      main(page)
        .getByRole('link', { name: /^Pest library \d/ })
        .waitFor(),
    keyboard: {
      does: 'the pest library opened from its tile',
      run: async (page) => {
        await pressOn(page, main(page).getByRole('link', { name: /^Pest library \d/ }));
        await page.getByRole('heading', { level: 1, name: 'Pest library' }).waitFor();
      },
    },
  },
  {
    page: homePage('adviser'),
    role: 'adviser',
    device: 'desk',
    url: () => '/',
    ready: (page) => page.locator('[data-attention="unacknowledged-notice"]').first().waitFor(),
    keyboard: {
      does: 'a field needing attention opened for review',
      run: async (page) => {
        // Lines about a field's sightings open its review (patches open the zone editor, notices their page).
        const reviewLines = '[data-attention="field-above-threshold"], [data-attention="not-yet-checked"], [data-attention="rescout-due"]';
        await pressOn(page, page.locator(reviewLines).getByRole('link').first());
        await page.waitForURL(/\/fields\/[0-9a-f-]{36}\/review/);
        await page.getByRole('button', { name: 'Run check' }).waitFor();
      },
    },
  },
  {
    page: homePage('scout'),
    role: 'scout',
    device: 'phone',
    url: () => '/',
    ready: (page, w) =>
      page
        .getByRole('list', { name: 'Fields assigned to you' })
        .getByRole('link', { name: new RegExp(w.walkedField.name) })
        .waitFor(),
    keyboard: {
      does: 'an assigned field opened',
      run: async (page, w) => {
        await pressOn(page, page.getByRole('link', { name: new RegExp(w.walkedField.name) }));
        await page.getByRole('link', { name: 'Carry on with today’s walk' }).waitFor();
      },
    },
  },
  {
    page: homePage('grower'),
    role: 'grower',
    device: 'desk',
    url: () => '/',
    ready: (page, w) =>
      page
        .getByRole('list', { name: 'Zone notices' })
        .getByRole('link', { name: new RegExp(`on ${w.noticed.field.name}`) })
        .first()
        .waitFor(),
    keyboard: {
      does: 'a zone notice opened',
      run: async (page, w) => {
        await pressOn(page, page.getByRole('link', { name: new RegExp(`on ${w.noticed.field.name}`) }).first());
        await page.getByRole('heading', { level: 1, name: new RegExp(`on ${w.noticed.field.name}`) }).waitFor();
      },
    },
  },

  // --- Admin ---
  {
    page: '/admin/users',
    role: 'admin',
    device: 'desk',
    url: () => '/admin/users',
    ready: (page, w) => page.getByRole('table', { name: 'Users' }).getByText(w.org.users.scout.email).waitFor(),
    keyboard: {
      does: 'a scout invited',
      run: async (page, w) => {
        const email = `new-scout-${w.org.id.slice(0, 8)}@test.example`;
        await focusTop(page);
        await typeInto(page, page.getByLabel('Name', { exact: true }), 'Odile Marsh');
        await typeInto(page, page.getByLabel('E-mail address', { exact: true }), email);
        await tabTo(page, page.getByLabel('Role', { exact: true }));
        expect(await page.getByLabel('Role', { exact: true }).inputValue()).toBe('scout');
        await tabTo(page, page.getByRole('button', { name: 'Send invitation' }));
        await page.keyboard.press('Enter');
        await page.getByText(`Invitation sent to ${email}`).waitFor();
        await page
          .getByRole('table', { name: 'Users' })
          .getByRole('row', { name: new RegExp(email) })
          .getByText('Invited')
          .waitFor();
        expect(findingsTable(await seriousViolations(page))).toBe('(none)');
      },
    },
  },
  {
    page: '/admin/pests',
    role: 'admin',
    device: 'desk',
    url: () => '/admin/pests',
    ready: (page) => page.getByRole('table', { name: 'Pest library' }).getByRole('row').nth(1).waitFor(),
    keyboard: {
      does: 'a pest added with its threshold and source',
      run: async (page) => {
        await pressOn(page, page.getByRole('button', { name: 'Add a pest' }));
        await page.getByRole('heading', { name: 'New pest' }).waitFor();
        await expectAccessible(page);
        await focusTop(page);
        await typeInto(page, page.getByLabel('Pest name'), 'Keyboard leafhopper');
        await typeInto(page, page.getByLabel('Count unit'), 'leafhoppers per sweep');
        await typeInto(page, page.getByLabel('Action threshold'), '2');
        await typeInto(page, page.getByLabel('Source of the threshold'), 'Test threshold, not agronomic advice');
        await tabTo(page, page.getByRole('button', { name: 'Add to the library' }));
        await page.keyboard.press('Enter');
        await page
          .getByRole('table', { name: 'Pest library' })
          .getByRole('row', { name: /Keyboard leafhopper/ })
          .waitFor();
      },
    },
  },
  {
    page: '/admin/dates',
    role: 'admin',
    device: 'desk',
    url: () => '/admin/dates',
    ready: (page) => page.getByTestId('preview-date').waitFor(),
    keyboard: {
      does: 'the locale changed with the arrow keys, previewed and saved (then put back for the other rows)',
      run: async (page, w) => {
        // A new organisation writes en-GB; the next locale in the list is en-US.
        await pressOn(page, page.getByLabel('Language and region'), 'ArrowDown');
        expect(await page.getByLabel('Language and region').inputValue()).toBe('en-US');
        await page
          .getByTestId('preview-date')
          .getByText(/^July /)
          .waitFor();
        await tabTo(page, page.getByRole('button', { name: 'Save dates and times' }));
        await page.keyboard.press('Enter');
        await page
          .getByRole('status')
          .getByText(/Saved\./)
          .waitFor();
        await expectAccessible(page);
        const stored = await w.admin.get('/api/config').expect(200);
        expect(stored.body.dateFormat.locale).toBe('en-US');
        await w.admin.put('/api/config/date-format', { locale: 'en-GB', timeZone: stored.body.dateFormat.timeZone }).expect(200);
      },
    },
  },
  {
    page: '/admin/mailbox',
    role: 'admin',
    device: 'desk',
    url: () => '/admin/mailbox',
    ready: (page) => page.getByRole('list', { name: 'Messages' }).getByRole('link').first().waitFor(),
    keyboard: {
      does: 'a message opened',
      run: async (page, w) => {
        await pressOn(page, page.getByRole('list', { name: 'Messages' }).locator(`a[href="/admin/mailbox/${w.mailMessageId}"]`));
        await page.waitForURL(new RegExp(`/admin/mailbox/${w.mailMessageId}$`));
        await page.getByRole('article').getByRole('heading', { level: 2 }).waitFor();
      },
    },
  },
  {
    page: '/admin/mailbox/:messageId',
    role: 'admin',
    device: 'desk',
    url: (w) => `/admin/mailbox/${w.mailMessageId}`,
    ready: async (page, w) => {
      await page
        .getByRole('article')
        .getByRole('heading', { level: 2, name: new RegExp(w.noticed.field.name) })
        .waitFor();
      await page.getByRole('link', { name: /\.geojson$/ }).waitFor();
    },
  },
  {
    page: '/admin/fields/:fieldId/edit',
    role: 'admin',
    device: 'desk',
    url: (w) => `/admin/fields/${w.walkedField.id}/edit`,
    ready: async (page, w) => {
      await page.getByRole('heading', { level: 1, name: `Edit ${w.walkedField.name}` }).waitFor();
      await page.locator('.leaflet-container').first().waitFor();
    },
    keyboard: {
      does: 'the drawing tools opened and named, then the crop changed and saved',
      run: async (page, w) => {
        // The arrow keys move through the boundary's radio group; drawing brings up the map's editing toolbar.
        await pressOn(page, page.getByLabel('Upload a file'), 'ArrowRight');
        expect(await page.getByLabel('Draw on the map').isChecked()).toBe(true);
        await page.getByRole('button', { name: 'Draw a shape corner by corner' }).waitFor();
        await expectAccessible(page);
        await pressOn(page, page.getByLabel('Draw on the map'), 'ArrowLeft');
        expect(await page.getByLabel('Upload a file').isChecked()).toBe(true);

        await focusTop(page);
        await typeInto(page, page.getByLabel('Crop'), 'corn');
        await tabTo(page, page.getByRole('button', { name: 'Save changes' }));
        await page.keyboard.press('Enter');
        await page.waitForURL(new RegExp(`/fields/${w.walkedField.id}$`));
        const stored = await w.admin.get(`/api/fields/${w.walkedField.id}`).expect(200);
        expect(stored.body.field.crop).toBe('corn');
      },
    },
  },

  // --- Adviser ---
  {
    page: '/fields',
    role: 'adviser',
    device: 'desk',
    url: () => '/fields',
    ready: (page, w) => page.getByRole('table', { name: 'Fields' }).getByRole('link', { name: w.noticed.field.name }).waitFor(),
    keyboard: {
      does: 'the table sorted by field name',
      run: async (page) => {
        const header = page.getByRole('columnheader', { name: /^Field/ });
        await pressOn(page, header.getByRole('button'));
        await expect.poll(() => header.getAttribute('aria-sort')).toBe('ascending');
      },
    },
  },
  {
    page: '/fields/:fieldId/zones',
    role: 'adviser',
    device: 'desk',
    url: (w) => `/fields/${w.unzoned.field.id}/zones?checkId=${w.unzoned.checkId}`,
    ready: async (page) => {
      await page.getByRole('table', { name: 'Treatment zones being edited' }).getByRole('row').nth(1).waitFor();
      await page.locator('.leaflet-container').first().waitFor();
    },
    keyboard: {
      does: 'the margin tuned, one zone dropped and the rest accepted',
      run: async (page, w) => {
        const zoneRows = page.getByRole('table', { name: 'Treatment zones being edited' }).getByRole('row');
        const proposed = page.waitForResponse((r) => r.url().includes(`/api/checks/${w.unzoned.checkId}/zone-proposal`) && r.request().method() === 'POST');
        await focusTop(page);
        await typeInto(page, page.getByLabel('Margin (m)'), '4');
        expect((await proposed).status()).toBe(200);
        await expect.poll(() => page.getByText('Updating the proposal…').count(), settle).toBe(0);
        const before = (await zoneRows.count()) - 1;
        expect(before, 'the two invented patches give two zones').toBeGreaterThanOrEqual(2);
        await pressOn(
          page,
          page
            .getByRole('table', { name: 'Treatment zones being edited' })
            .getByRole('button', { name: /^Delete / })
            .first(),
        );
        await expect.poll(() => zoneRows.count()).toBe(before);
        await pressOn(page, page.getByRole('button', { name: 'Accept zones' }));
        await page.getByText(`Stored as version 1 (${before - 1} zone`).waitFor({ timeout: 30_000 });
        expect(findingsTable(await seriousViolations(page))).toBe('(none)');
        await pressOn(page, page.getByRole('link', { name: 'Write the notice' }).first());
        await page.getByLabel('Recommendation').waitFor();
      },
    },
  },
  {
    page: '/fields/:fieldId/notices/new',
    role: 'adviser',
    device: 'desk',
    url: (w) => `/fields/${w.noticed.field.id}/notices/new?zoneSetId=${w.zoneSetId}&checkId=${w.noticed.checkId}`,
    ready: async (page) => {
      await page.getByLabel('Recommendation').waitFor();
      await page.getByRole('table').first().waitFor();
    },
    keyboard: {
      does: 'the recommendation written and the draft saved for preview',
      run: async (page) => {
        await focusTop(page);
        await typeInto(page, page.getByLabel('Recommendation'), RECOMMENDATION);
        await tabTo(page, page.getByRole('button', { name: 'Save and preview' }));
        await page.keyboard.press('Enter');
        await page.waitForURL(/\/notices\/[0-9a-f-]{36}$/);
        await expect.poll(() => page.getByTestId('notice-status').textContent(), settle).toBe('Draft, not sent');
        await page.getByText(RECOMMENDATION).first().waitFor();
      },
    },
  },
  {
    page: '/notices',
    role: 'adviser',
    device: 'desk',
    url: () => '/notices',
    ready: (page) => page.getByRole('table', { name: 'Zone notices' }).locator('tbody tr').first().waitFor(),
    keyboard: {
      does: 'the list narrowed to drafts and a draft opened',
      run: async (page, w) => {
        await tabTo(page, page.getByLabel('State'));
        // A native select takes the first option starting with the typed letters.
        await page.keyboard.type('Drafts');
        const statuses = page.getByRole('table', { name: 'Zone notices' }).locator('tbody tr td:nth-child(3)');
        await expect.poll(async () => [...new Set(await statuses.allTextContents())], settle).toEqual(['Draft']);
        await pressOn(page, page.locator(`tr[data-notice="${w.draftNoticeId}"]`).getByRole('link'));
        await page.waitForURL(new RegExp(`/notices/${w.draftNoticeId}$`));
      },
    },
  },
  {
    page: '/notices/:noticeId',
    role: 'adviser',
    device: 'desk',
    url: (w) => `/notices/${w.draftNoticeId}`,
    ready: async (page) => {
      await expect.poll(() => page.getByTestId('notice-status').textContent(), settle).toBe('Draft, not sent');
      await page.getByTestId('preview-subject').waitFor();
    },
    keyboard: {
      does: 'the draft sent and its copies followed',
      run: async (page, w) => {
        await pressOn(page, page.getByRole('button', { name: 'Send the notice' }));
        // The confirmation lists who gets it; its own send button is reached with Tab inside the dialog.
        const dialog = page.getByRole('dialog', { name: 'Send this notice?' });
        await dialog.getByRole('checkbox', { name: new RegExp(w.org.users.grower.email) }).waitFor();
        // The page behind a modal dialog is inert, so only axe-core's findings are checked while it is open.
        const findings = await seriousViolations(page);
        expect(findings, findingsTable(findings)).toEqual([]);
        await tabTo(page, dialog.getByRole('button', { name: 'Send to 1 recipient' }));
        await page.keyboard.press('Enter');
        await expect.poll(() => page.getByTestId('notice-status').textContent(), settle).toBe('Sent to every contact');
        await page.getByRole('table', { name: 'Recipients of this notice' }).waitFor();
        await expectAccessible(page);
        // The sent e-mail folds away under a disclosure that opens from the keyboard.
        await pressOn(page, page.getByText('The e-mail as sent'));
        await page.getByTestId('preview-subject').waitFor();
        // One e-mail for the notice sent before, one for this one.
        expect(await waitForMessage(w.org.users.grower.email, 2, 30_000)).toHaveLength(2);
      },
    },
  },

  // --- Scout ---
  {
    page: '/scout/fields',
    role: 'scout',
    device: 'phone',
    url: () => '/scout/fields',
    ready: (page, w) =>
      page
        .getByRole('list', { name: 'Fields assigned to you' })
        .getByRole('link', { name: new RegExp(w.walkedField.name) })
        .waitFor(),
    keyboard: {
      does: 'the upload-anywhere page opened',
      run: async (page) => {
        await pressOn(page, page.getByRole('link', { name: /^Just upload/ }));
        await page.getByRole('heading', { level: 1, name: 'Just upload' }).waitFor();
      },
    },
  },
  {
    page: '/scout/fields/:fieldId',
    role: 'scout',
    device: 'phone',
    url: (w) => `/scout/fields/${w.walkedField.id}`,
    ready: (page) => page.getByRole('link', { name: 'Carry on with today’s walk' }).waitFor(),
    keyboard: {
      does: 'today’s walk opened',
      run: async (page, w) => {
        await pressOn(page, page.getByRole('link', { name: 'Carry on with today’s walk' }));
        await page.waitForURL(new RegExp(`/scout/walks/${w.walkId}$`));
        await page.getByRole('button', { name: 'Nothing found here' }).waitFor();
      },
    },
  },
  {
    page: '/scout/upload',
    role: 'scout',
    device: 'phone',
    url: () => '/scout/upload',
    ready: (page) => page.getByLabel('Pest').waitFor(),
    keyboard: {
      does: 'a photo chosen and sent to the field it was taken in',
      run: async (page, w) => {
        const row = await sendOnePhotoByKeyboard(page, {
          name: 'headland.jpg',
          buffer: await makeJpeg({ gps: { lon: TEST_FIELD_CORNER.lon + 0.003, lat: TEST_FIELD_CORNER.lat + 0.002 }, markSeed: 21 }),
        });
        expect(await row.getAttribute('data-outcome')).toBe('placed');
        await row.getByText(new RegExp(w.walkedField.name)).first().waitFor();
        await expectAccessible(page);
      },
    },
  },
  {
    page: '/scout/walks/:walkId/pin/:sightingId',
    role: 'scout',
    device: 'phone',
    url: (w) => `/scout/walks/${w.walkId}/pin/${w.needsPinId}`,
    ready: async (page) => {
      await page.getByRole('heading', { level: 1, name: 'Pin a photo' }).waitFor();
      await page.locator('.leaflet-container').first().waitFor();
    },
    keyboard: {
      does: 'the pin placed from the phone’s position, then from typed coordinates, and confirmed',
      run: async (page, w) => {
        await pressOn(page, page.getByRole('button', { name: 'Use where I am standing now' }));
        await expect.poll(() => page.getByLabel('Latitude').inputValue(), settle).toBe(PHONE_POSITION.latitude.toFixed(6));
        expect(await page.getByLabel('Longitude').inputValue()).toBe(PHONE_POSITION.longitude.toFixed(6));
        await page.getByText(/^Chosen: /).waitFor();

        // A latitude past the pole is refused beside its box, in the schema's words.
        await focusTop(page);
        await typeInto(page, page.getByLabel('Latitude'), '95');
        await tabTo(page, page.getByRole('button', { name: 'Put the pin at these coordinates' }));
        await page.keyboard.press('Enter');
        await page.getByText('Latitude must lie between −90 and 90.').waitFor();
        expect(await page.getByLabel('Latitude').getAttribute('aria-invalid')).toBe('true');
        expect(findingsTable(await seriousViolations(page))).toBe('(none)');

        await focusTop(page);
        await typeInto(page, page.getByLabel('Latitude'), String(TYPED_PIN.lat));
        await typeInto(page, page.getByLabel('Longitude'), String(TYPED_PIN.lon));
        await tabTo(page, page.getByRole('button', { name: 'Put the pin at these coordinates' }));
        await page.keyboard.press('Enter');
        await expect.poll(() => page.getByLabel('Latitude').getAttribute('aria-invalid')).toBeNull();
        await expect.poll(() => page.locator('path.pin-choice').count()).toBe(1);
        await tabTo(page, page.getByRole('button', { name: 'Confirm this place' }));
        await page.keyboard.press('Enter');
        await page.waitForURL(new RegExp(`/scout/walks/${w.walkId}$`));

        const stored = await w.scout.get(`/api/walks/${w.walkId}`).expect(200);
        const pinned = (stored.body.sightings as SightingView[]).find((s) => s.id === w.needsPinId)!;
        expect(pinned).toMatchObject({ status: 'placed', positionSource: 'pin' });
        expect(pinned.position!.lat).toBeCloseTo(TYPED_PIN.lat, 9);
        expect(pinned.position!.lon).toBeCloseTo(TYPED_PIN.lon, 9);
        // @turf/turf as the outside judge of "inside the field".
        expect(booleanPointInPolygon([pinned.position!.lon, pinned.position!.lat], rectangleBoundary())).toBe(true);
      },
    },
  },

  // --- Grower ---
  {
    page: '/grower/notices/:noticeId',
    role: 'grower',
    device: 'desk',
    url: (w) => `/grower/notices/${w.sentNoticeId}`,
    ready: async (page, w) => {
      await page.getByRole('heading', { level: 1, name: new RegExp(`on ${w.noticed.field.name}`) }).waitFor();
      await page.getByRole('table', { name: 'Treatment zones' }).waitFor();
    },
    keyboard: {
      does: 'the notice acknowledged',
      run: async (page) => {
        await pressOn(page, page.getByRole('button', { name: 'Acknowledge' }));
        await page.getByText(/Acknowledged on/).waitFor();
        expect(findingsTable(await seriousViolations(page))).toBe('(none)');
      },
    },
  },
];

describe('every signed-in page has an accessibility check', () => {
  const covered = [...rows.map((r) => r.page), ...coveredInAccessibilityTest.map((c) => c.page)];
  const gaps = coverageGaps(covered);

  it('each page of src/app/routes.tsx has a row here or a test in accessibility.test.ts', () => {
    expect(gaps.missing, `add a row to tests/e2e/accessibility-pages.test.ts for each of: ${gaps.missing.join(', ')}`).toEqual([]);
  });

  it('no row names a page the client does not serve, and none is checked twice', () => {
    expect(gaps.stale, 'rows for pages no longer in src/app/routes.tsx').toEqual([]);
    expect(gaps.twice, 'pages with two rows').toEqual([]);
  });

  it('each row signs in with a role that may open its page', () => {
    expect(rows.filter((r) => !rolesOf(r.page).includes(r.role)).map((r) => `${r.page} as ${r.role}`)).toEqual([]);
  });

  it('the pages said to be covered in accessibility.test.ts have that test there', () => {
    const source = fs.readFileSync(path.join(import.meta.dirname, 'accessibility.test.ts'), 'utf8');
    expect(coveredInAccessibilityTest.filter((c) => !source.includes(`it('${c.test}`)).map((c) => c.test)).toEqual([]);
  });
});

describe('accessibility of each signed-in page', { timeout: 240_000 }, () => {
  let server: TestServer;
  let browser: Browser;
  let world: World;
  // One keyboard sign-in per role; later pages of the role start from its stored session.
  const sessions = new Map<Role, Awaited<ReturnType<BrowserContext['storageState']>>>();

  beforeAll(async () => {
    // Workers on: the notice e-mails go out through the queue.
    let org: TestOrganisation;
    [server, browser, org] = await Promise.all([startTestServer({ workers: true }), launchBrowser(), makeOrganisation('Every page')]);
    const admin = await signedIn(org.users.admin.email);
    const adviser = await signedIn(org.users.adviser.email);
    const scout = await signedIn(org.users.scout.email);

    const farm = await createFarm(admin, { name: 'Ashgrove' });
    const walkedField = await createField(admin, farm.id, rectangleBoundary(), { name: 'Quarry Piece' });
    const pest = await createPest(admin, { countUnit: 'aphids per plant' });
    await admin.post(`/api/fields/${walkedField.id}/scouts`, { userId: org.users.scout.id }).expect(204);
    const today = new Date();
    const walkedOn = `${today.getFullYear()}-${String(today.getMonth() + 1).padStart(2, '0')}-${String(today.getDate()).padStart(2, '0')}`;
    const walkId = (await scout.post('/api/walks', { fieldId: walkedField.id, walkedOn }).expect(201)).body.walk.id as string;
    const upload = await uploadPhotos(scout, [{ bytes: await makeJpeg({ markSeed: 3 }), name: 'no-gps.jpg' }], { walkId, pestId: pest.id }).expect(200);
    expect(upload.body.results[0].outcome).toBe('needs-pin');

    const noticed = await makeCheckedField(org, adviser, { fieldName: 'Lower Bottoms', seed: 11 });
    const unzoned = await makeCheckedField(org, adviser, { fieldName: 'Far Slope', seed: 29 });
    const zoneSet = await acceptProposedZones(adviser, noticed);
    // The grower contact is the grower's own account, so the signed-in grower holds a copy to acknowledge.
    await addContacts(noticed.field.farmId, [{ name: org.users.grower.name, email: org.users.grower.email }]);
    await linkGrower(noticed.field.farmId, org.users.grower.id);
    const sent = await adviser.post('/api/notices', { fieldId: noticed.field.id, zoneSetId: zoneSet.id, recommendation: RECOMMENDATION }).expect(201);
    await adviser.post(`/api/notices/${sent.body.notice.id}/send`).expect(202);
    const draft = await adviser.post('/api/notices', { fieldId: noticed.field.id, zoneSetId: zoneSet.id, recommendation: RECOMMENDATION }).expect(201);
    await waitForMessage(org.users.grower.email, 1, 30_000);
    const mailbox = await admin.get('/api/mailbox').expect(200);
    const noticeMail = (mailbox.body.messages as Array<{ id: number; subject: string | null }>).find((m) => m.subject?.includes(noticed.field.name));
    if (!noticeMail) throw new Error(`no notice e-mail in the mailbox: ${JSON.stringify(mailbox.body.messages)}`);

    world = {
      org,
      admin,
      scout,
      walkedField,
      walkId,
      needsPinId: upload.body.results[0].sightingId,
      noticed,
      zoneSetId: zoneSet.id,
      sentNoticeId: sent.body.notice.id,
      draftNoticeId: draft.body.notice.id,
      mailMessageId: noticeMail.id,
      unzoned,
    };
  });

  afterAll(async () => {
    await browser?.close();
    await server?.close();
  });

  async function openAs(row: PageRow): Promise<{ context: BrowserContext; page: Page }> {
    const stored = sessions.get(row.role);
    const context = await newContext(browser, row.device, stored);
    const page = await context.newPage();
    if (!stored) {
      await signInByKeyboard(page, server.url, world.org.users[row.role].email);
      sessions.set(row.role, await context.storageState());
    }
    return { context, page };
  }

  it('the axe check reads a sandboxed frame (an e-mail shown as sent) as a document of its own and reports what is wrong in it', async () => {
    const context = await browser.newContext();
    try {
      const page = await context.newPage();
      await page.setContent(`<!doctype html><html lang="en"><head><title>Framed on purpose</title></head><body><main><h1>Framed on purpose</h1>
        <iframe title="A message" sandbox="" srcdoc="<!doctype html><html lang='en'><head><title>Message</title></head><body><main><input type='text'></main></body></html>"></iframe>
      </main></body></html>`);
      const findings = await seriousViolations(page);
      expect(findings.map((f) => f.rule)).toContain('label');
      expect(findings.map((f) => f.target)).toEqual(findings.map(() => expect.stringMatching(/^iframe “A message” › /)));
    } finally {
      await context.close();
    }
  });

  it.each(rows.map((row) => [`${row.page} as ${row.role}${row.keyboard ? `, ${row.keyboard.does}` : ''}`, row] as const))(
    '%s: no serious violation, every control reachable, main job by keyboard',
    async (_name, row) => {
      const { context, page } = await openAs(row);
      try {
        await page.goto(`${server.url}${row.url(world)}`);
        await row.ready(page, world);
        await expectAccessible(page);
        await row.keyboard?.run(page, world);
      } finally {
        await context.close();
      }
    },
  );
});
