// What a person reads, as the browser renders it: the bandwidth in one sentence, technical identifiers only behind their
// disclosure, walk days in the organisation's date format, and unit symbols that keep their case through any styling. `innerText` is the text after CSS (text-transform applied, WHATWG HTML "innerText getter"), so an upper-casing style
// would show here as "HA" or "25 M". Unit symbols: SI Brochure (BIPM, 9th ed. 2019) §5.2, symbols never change case;
// "ha" Table 8; "ac" is common practice in agriculture.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Locator, Page } from 'playwright-core';
import { launchBrowser, startTestServer, type TestServer } from '../helpers/browser.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, TEST_PASSWORD, type TestOrganisation } from '../helpers/org.ts';
import { noticeLinkToken, waitForMessage } from '../helpers/mailbox.ts';
import type { CheckView } from '../../shared/schemas/checks.ts';
import { acceptProposedZones, addContacts, makeCheckedField, type ScoutedCheck } from '../helpers/zones.ts';

let server: TestServer;
let browser: Browser;
let org: TestOrganisation;
let adviser: Client;
let scouted: ScoutedCheck;
let noticeToken: string;
const contact = { name: 'Units contact', email: `units-${Date.now()}@farm.example` };

beforeAll(async () => {
  [server, browser, org] = await Promise.all([startTestServer({ workers: true }), launchBrowser(), makeOrganisation('Units and dates')]);
  adviser = await signedIn(org.users.adviser.email);
  scouted = await makeCheckedField(org, adviser, { fieldName: 'Units meadow' });
  await addContacts(scouted.field.farmId, [contact]);
  const zoneSet = await acceptProposedZones(adviser, scouted);
  const drafted = await adviser
    .post('/api/notices', { fieldId: scouted.field.id, zoneSetId: zoneSet.id, recommendation: 'Spot-spray the zones this week.', rescoutOn: '2026-07-14' })
    .expect(201);
  await adviser.post(`/api/notices/${drafted.body.notice.id}/send`).expect(202);
  const [mail] = await waitForMessage(contact.email, 1, 30_000);
  noticeToken = noticeLinkToken(mail);
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

async function signInAsAdviser(page: Page) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail address').fill(org.users.adviser.email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
}

const shown = (locator: Locator) => locator.evaluate((el) => (el as HTMLElement).innerText);

/** The area headers read "Area (ha)" and "Area (ac)" as rendered, with no symbol upper-cased. */
async function expectAreaHeaders(table: Locator) {
  const headers = await shown(table.locator('thead'));
  expect(headers).toContain('Area (ha)');
  expect(headers).toContain('Area (ac)');
  expect(headers).not.toMatch(/\bHA\b|\bAC\b/);
}

async function openLatestCheck(page: Page) {
  await page.goto(`${server.url}/fields/${scouted.field.id}/review?pest=${scouted.pest.id}`);
  await page.locator('[data-verdict]').waitFor({ timeout: 60_000 });
}

describe('the check explained in words', () => {
  it('explains the bandwidth in one sentence and keeps the engine version and projection code in the closed disclosure', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signInAsAdviser(page);
    await openLatestCheck(page);
    // The bandwidth's explanation is the engine's one sentence: how far each sighting counts and the rule's published name.
    const stored = (await (await page.request.get(`${server.url}/api/checks/${scouted.checkId}`)).json()) as { check: CheckView };
    const sentence = stored.check.result!.density!.bandwidthSentence;
    expect(await shown(page.locator('[data-figure="bandwidth"] + dd'))).toBe(sentence);
    expect(sentence).toMatch(
      /^Each sighting counts within \d+ m of it, less with distance, and not at all beyond \([^()]*Silverman's normal-reference rule[^()]*\)\.$/,
    );
    // Engine version and projection code are read only from the closed disclosure (closed, its text is not rendered).
    const pageText = await shown(page.locator('main'));
    expect(pageText).not.toMatch(/EPSG|Engine version/);
    const technical = page.locator('[data-technical-details]');
    await technical.locator('summary').click();
    expect(await shown(technical)).toMatch(/Engine version .*projection EPSG:\d+/);
    await page.close();
  });
});

describe('dates as the organisation writes them', () => {
  // The organisation keeps the default format, en-GB: CLDR's long date "d MMMM y", e.g. "1 July 2026" (ECMA-402).
  const longGb = /^\d{1,2} [A-Z][a-z]+ 2026/;
  const iso = /\d{4}-\d{2}-\d{2}/;

  it('writes the season chart’s walk days and the walk filter’s choices as "1 July 2026", never as 2026-07-01', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signInAsAdviser(page);
    await openLatestCheck(page);
    const ticks = page.locator('figure[aria-label="Sightings and mean count per walk"] .recharts-xAxis-tick-labels .recharts-cartesian-axis-tick-value');
    await ticks.first().waitFor();
    const tickTexts = await ticks.allTextContents();
    expect(tickTexts.length).toBeGreaterThan(0);
    for (const text of tickTexts) {
      expect(text).toMatch(longGb);
      expect(text).not.toMatch(iso);
    }
    // makeCheckedField walks the field on 2026-07-01 and 2026-07-03, newest first in the filter.
    const walkFilter = page.locator('select', { has: page.locator('option', { hasText: 'Every walk' }) });
    await expect.poll(() => walkFilter.locator('option').count(), { timeout: 15_000 }).toBe(3);
    const walkOptions = await walkFilter.locator('option').allTextContents();
    for (const text of walkOptions.slice(1)) {
      expect(text).toMatch(longGb);
      expect(text).not.toMatch(iso);
    }
    expect(walkOptions[1]).toMatch(/^3 July 2026 · /);
    expect(walkOptions[2]).toMatch(/^1 July 2026 · /);
    await page.close();
  });
});

describe('unit symbols as the browser renders them', () => {
  it('keeps "ha", "ac" and "m" in lower case in the review page’s zone and robustness tables and in the zone editor', async () => {
    const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
    await signInAsAdviser(page);
    await openLatestCheck(page);
    await expectAreaHeaders(page.getByRole('table', { name: 'Proposed treatment zones' }));
    // The bandwidth figure, as written beside its name.
    expect(await shown(page.locator('[data-figure="bandwidth"]'))).toMatch(/\d m$/);

    await page.getByRole('button', { name: 'Test robustness' }).click();
    const robustness = page.getByRole('table', { name: 'Verdict by area basis and cell size' });
    await robustness.waitFor({ timeout: 120_000 });
    const robustnessHeaders = await shown(robustness.locator('thead'));
    // "Cells × 2 (25 m)": the cell side in metres beside each factor.
    expect(robustnessHeaders).toMatch(/× \d+(\.\d+)? \(\d+ m\)/);
    expect(robustnessHeaders).not.toMatch(/\d M\b/);

    await page.goto(`${server.url}/fields/${scouted.field.id}/zones?checkId=${scouted.checkId}`);
    const editing = page.getByRole('table', { name: 'Treatment zones being edited' });
    await editing.locator('tbody tr').first().waitFor();
    await expectAreaHeaders(editing);
    await page.close();
  });

  it('keeps "ha" and "ac" in lower case in the zone table of the notice page the grower opens', async () => {
    const page = await browser.newPage({ viewport: { width: 1200, height: 900 } });
    await page.goto(`${server.url}/n/${noticeToken}`);
    const table = page.getByRole('table', { name: 'Treatment zones' });
    await table.locator('tbody tr').first().waitFor();
    await expectAreaHeaders(table);
    expect(await shown(page.locator('main'))).not.toMatch(/EPSG|Engine version/);
    await page.close();
  });
});
