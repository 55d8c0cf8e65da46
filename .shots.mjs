import { chromium } from 'playwright-core';
const base = 'http://127.0.0.1:3000';
const [role, ...paths] = process.argv.slice(2);
const mobile = process.env.MOBILE === '1';
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: ['--no-sandbox','--disable-gpu','--disable-background-networking','--disable-component-update','--disable-sync','--no-first-run'] });
const ctx = await browser.newContext(mobile ? { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 1 } : { viewport: { width: 1300, height: 900 } });
const page = await ctx.newPage();
await page.goto(base + '/sign-in');
await page.getByLabel('E-mail address').fill(`${role}@larkspur.example`);
await page.getByLabel('Password').fill('patchwise-demo-2026');
await page.getByRole('button', { name: 'Sign in' }).click();
await page.waitForTimeout(2500);
let i = 0;
for (const p of ['', ...paths]) {
  if (p) { await page.goto(base + p); await page.waitForTimeout(3500); }
  const name = `/tmp/shots/${role}${mobile ? '-m' : ''}-${i++}.png`;
  await page.screenshot({ path: name, fullPage: true });
  console.log(name, page.url());
}
await browser.close();
