// The scout's phone in browser journeys: a phone-sized touch context, signing the scout in, starting today's walk,
// and reading the photo rows of the walk page. One copy for every scout journey.
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { TEST_PASSWORD } from './org.ts';

export interface PhoneOptions {
  /**
   * 'allow' lets the app's service worker run (offline journeys); 'block' (the default) keeps it out, since route
   * interception and request counting cannot see what a service worker answers.
   */
  serviceWorkers?: 'allow' | 'block';
  /** Where the phone says it stands, granted to `origin` (the test server's URL). */
  position?: { longitude: number; latitude: number; accuracy: number };
  origin?: string;
}

/** A phone-sized browser context with touch, as the scout's pages are meant for. */
export async function scoutPhone(browser: Browser, options: PhoneOptions = {}): Promise<BrowserContext> {
  const context = await browser.newContext({
    viewport: { width: 390, height: 844 },
    deviceScaleFactor: 2,
    isMobile: true,
    hasTouch: true,
    serviceWorkers: options.serviceWorkers ?? 'block',
  });
  if (options.position) {
    if (!options.origin) throw new Error('A phone position needs the origin it is granted to (the test server URL).');
    await context.grantPermissions(['geolocation'], { origin: options.origin });
    await context.setGeolocation(options.position);
  }
  return context;
}

/** Signs the scout in on a new page of the phone; the page ends on the scout's start page. */
export async function signInOnPhone(context: BrowserContext, serverUrl: string, email: string): Promise<Page> {
  const page = await context.newPage();
  await page.goto(`${serverUrl}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(TEST_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).tap();
  await page.getByRole('link', { name: 'Walk a field' }).waitFor();
  return page;
}

/** From the field's page, starts today's walk (online or not) and answers its id as the walk page's address shows it. */
export async function startTodaysWalk(page: Page, serverUrl: string, fieldId: string): Promise<string> {
  await page.goto(`${serverUrl}/scout/fields/${fieldId}`);
  await page.getByRole('button', { name: 'Start a walk for today' }).tap();
  await page.waitForURL(/\/scout\/walks\/[0-9a-f-]{36}$/);
  return page.url().split('/').at(-1)!;
}

/** The photo rows of the walk page (or the upload page), and the state each is in. */
export const uploadRows = (page: Page) => page.getByRole('list', { name: 'Photos in this batch' }).getByRole('listitem');
export const uploadStates = (page: Page) => uploadRows(page).evaluateAll((items) => items.map((i) => i.getAttribute('data-upload-state')));
