// Review-page benchmark: a field with 5,000 sightings in headless Chromium (time until the map has drawn
// them and the table shows its rows), the built client's initial JavaScript gzipped against its budget,
// and the check API's p95 for a stored result under 50 concurrent requests. Prints a table; asserts nothing.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import autocannon, { type Result as LoadResult } from 'autocannon';
import { startThrowawayDatabase } from './lib/throwaway-database.ts';
import { projectRoot } from '../lib/local-env.ts';
import type { BenchTable } from './table.ts';
import { SIGHTING_PAGE } from '../../shared/schemas/sightings.ts';

const SIGHTINGS = 5_000;
const PAGE_LOADS = 3;
const INITIAL_JS_BUDGET_KB = 300;
const CONCURRENCY = 50;
const LOAD_SECONDS = 6;
const CHROMIUM_ARGS = ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'];

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
/** Nearest-rank percentile (the smallest value with at least share × n values at or below it). */
const percentile = (values: number[], share: number) => [...values].sort((a, b) => a - b)[Math.max(0, Math.ceil(share * values.length) - 1)] ?? NaN;
const ms = (value: number) => (value >= 1000 ? `${(value / 1000).toFixed(2)} s` : `${value.toFixed(0)} ms`);

/** The entry chunk named in index.html and every chunk it imports statically, transitively. */
export function initialChunks(distDir: string): string[] {
  const html = fs.readFileSync(path.join(distDir, 'index.html'), 'utf8');
  const entry = html.match(/<script[^>]+type="module"[^>]+src="\/([^"]+)"/)?.[1];
  if (!entry) throw new Error(`No module entry script in ${distDir}/index.html.`);
  const seen = new Set<string>();
  const visit = (file: string) => {
    if (seen.has(file)) return;
    seen.add(file);
    const code = fs.readFileSync(path.join(distDir, file), 'utf8');
    // Static imports only (`import … from "./x.js"` or `import "./x.js"`); `import("./x.js")` is lazy.
    for (const match of code.matchAll(/\bimport\s*(?:[\w$*{}\s,]+from\s*)?["'](\.\/[^"']+\.js)["']/g)) {
      visit(path.posix.join(path.posix.dirname(file), match[1]));
    }
  };
  visit(entry);
  return [...seen];
}

function gzipKb(distDir: string, files: string[]) {
  return files.reduce((sum, file) => sum + zlib.gzipSync(fs.readFileSync(path.join(distDir, file)), { level: 9 }).length, 0) / 1024;
}

/** 5,000 sightings in loose patches over the field, a fifth of them empty stops, spread over four walks. */
function benchStops(corner: { lon: number; lat: number }, size: { lon: number; lat: number }, random: () => number) {
  const centres = Array.from({ length: 12 }, () => [0.1 + 0.8 * random(), 0.1 + 0.8 * random()]);
  return Array.from({ length: SIGHTINGS }, (_, i) => {
    const empty = i % 5 === 0;
    const [cx, cy] = empty ? [random(), random()] : centres[i % centres.length];
    const spread = empty ? 0 : 0.06;
    const x = Math.min(0.999, Math.max(0.001, cx + spread * (random() - 0.5)));
    const y = Math.min(0.999, Math.max(0.001, cy + spread * (random() - 0.5)));
    return { lon: corner.lon + x * size.lon, lat: corner.lat + y * size.lat, count: empty ? 0 : 1 + Math.round(20 * random()) };
  });
}

export async function run(): Promise<BenchTable> {
  const database = await startThrowawayDatabase('review');
  let server: Server | null = null;
  let closeDatabase: () => Promise<void> = async () => {};
  let browser: import('playwright-core').Browser | null = null;
  try {
    const distDir = path.join(database.workDir, 'dist');
    // Its own build, so a build running elsewhere in the tree cannot swap chunks under the browser.
    const build = spawnSync('npx', ['vite', 'build', '--logLevel', 'error', '--outDir', distDir, '--emptyOutDir'], {
      cwd: projectRoot,
      env: { ...process.env, NODE_ENV: 'production' },
      encoding: 'utf8',
    });
    if (build.status !== 0) throw new Error(`The client build failed: ${build.stderr}`);
    process.env.CLIENT_DIR = distDir;

    const { makeOrganisation, TEST_PASSWORD } = await import('../../tests/helpers/org.ts');
    const { addSightings, makeField, makePest, makeWalk, TEST_FIELD_CORNER, TEST_FIELD_SIZE } = await import('../../tests/helpers/sightings.ts');
    const { createRandom } = await import('../../shared/analysis/random.ts');
    const { createApp } = await import('../../server/app.ts');
    const { sequelize } = await import('../../server/db.ts');

    const org = await makeOrganisation('Bench');
    const field = await makeField(org);
    const pest = await makePest(org);
    const stops = benchStops(TEST_FIELD_CORNER, TEST_FIELD_SIZE, createRandom('review-bench'));
    for (let w = 0; w < 4; w++) {
      const walkId = await makeWalk(org, field.id, `2026-07-0${w + 1}`);
      await addSightings(
        org,
        { fieldId: field.id, walkId, pestId: pest.id },
        stops.filter((_, i) => i % 4 === w),
      );
    }

    const app = createApp();
    server = await new Promise<Server>((resolve) => {
      const s = app.listen(0, '127.0.0.1', () => resolve(s));
    });
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

    const { chromium } = await import('playwright-core');
    browser = await chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: CHROMIUM_ARGS });
    const context = await browser.newContext({ viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    await page.goto(`${base}/sign-in`);
    await page.getByLabel('E-mail address').fill(org.users.adviser.email);
    await page.getByLabel('Password').fill(TEST_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Needs your attention' }).waitFor();

    const mapTimes: number[] = [];
    const tableTimes: number[] = [];
    for (let i = 0; i < PAGE_LOADS; i++) {
      const started = Date.now();
      await page.goto(`${base}/fields/${field.id}/review?pest=${pest.id}`);
      const table = page
        .locator('[data-filtered-count]')
        .waitFor({ timeout: 60_000 })
        .then(() =>
          page
            .getByRole('table', { name: /Sightings in/ })
            .locator('tbody tr')
            .first()
            .waitFor(),
        )
        .then(() => tableTimes.push(Date.now() - started));
      // The sightings canvas exists once Leaflet has loaded and the dots are drawn on it.
      const map = page
        .locator('.leaflet-overlay-pane canvas')
        .first()
        .waitFor({ timeout: 60_000 })
        .then(() => mapTimes.push(Date.now() - started));
      await Promise.all([map, table]);
    }

    // Store one check, then hammer its GET. Few simulations keep it inline: the bench measures the read.
    const cookie = (await context.cookies()).map((c) => `${c.name}=${c.value}`).join('; ');
    const csrf = ((await (await fetch(`${base}/api/auth/csrf`, { headers: { cookie } })).json()) as { csrfToken: string }).csrfToken;
    const stored = await fetch(`${base}/api/checks`, {
      method: 'POST',
      headers: { cookie, 'content-type': 'application/json', 'x-csrf-token': csrf },
      body: JSON.stringify({ fieldId: field.id, pestId: pest.id, options: { simulations: 19 } }),
    });
    const { check } = (await stored.json()) as { check: { id: string; status: string } };
    if (check?.status !== 'done') throw new Error(`The check did not finish inline (status ${check?.status ?? stored.status}).`);
    const resultBytes = (await (await fetch(`${base}/api/checks/${check.id}`, { headers: { cookie } })).arrayBuffer()).byteLength;
    const latencies: number[] = [];
    const load = await new Promise<LoadResult>((resolve, reject) => {
      const instance = autocannon(
        { url: `${base}/api/checks/${check.id}`, connections: CONCURRENCY, duration: LOAD_SECONDS, headers: { cookie } },
        (error, result) => (error ? reject(error) : resolve(result)),
      );
      // autocannon's summary stops at p90/p97.5; the p95 comes from every response time.
      instance.on('response', (_client, _status, _bytes, responseTimeMs) => latencies.push(responseTimeMs));
    });

    // The whole field as the review reads it: page after page at the largest size.
    const listStarted = Date.now();
    let listBytes = 0;
    let listPages = 0;
    let cursor: string | null = null;
    do {
      const listed: Response = await fetch(
        `${base}/api/sightings?fieldId=${field.id}&status=placed&limit=${SIGHTING_PAGE.max}${cursor ? `&cursor=${cursor}` : ''}`,
        {
          headers: { cookie },
        },
      );
      const text: string = await listed.text();
      listBytes += Buffer.byteLength(text);
      listPages++;
      cursor = (JSON.parse(text) as { nextCursor: string | null }).nextCursor;
    } while (cursor);
    const listMs = Date.now() - listStarted;

    const chunks = initialChunks(distDir);
    const initialKb = gzipKb(distDir, chunks);
    closeDatabase = () => sequelize.close();
    return {
      title: `Field review with ${SIGHTINGS.toLocaleString('en')} sightings (headless Chromium, loopback)`,
      rows: [
        { measure: 'Map drawn (canvas), median', value: ms(median(mapTimes)), note: `${PAGE_LOADS} loads: ${mapTimes.map(ms).join(', ')}` },
        { measure: 'Table rows shown, median', value: ms(median(tableTimes)), note: `${PAGE_LOADS} loads: ${tableTimes.map(ms).join(', ')}` },
        { measure: 'GET /api/sightings (whole field), every page', value: ms(listMs), note: `${listPages} pages, ${(listBytes / 1024).toFixed(0)} KB of JSON` },
        {
          measure: 'Initial JS (gzip)',
          value: `${initialKb.toFixed(1)} KB`,
          note: `${chunks.length} chunks; budget ${INITIAL_JS_BUDGET_KB} KB — ${initialKb <= INITIAL_JS_BUDGET_KB ? 'within' : 'OVER'}`,
        },
        {
          measure: 'GET /api/checks/:id p95',
          value: ms(percentile(latencies, 0.95)),
          note: `${CONCURRENCY} connections, ${LOAD_SECONDS} s, ${load.requests.total} requests, ${load.non2xx} non-2xx, ${(resultBytes / 1024).toFixed(0)} KB each`,
        },
      ],
    };
  } finally {
    await browser?.close().catch(() => {});
    if (server) {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server!.close(() => resolve()));
    }
    // Only after the server: requests still in flight when the load ends need the pool.
    await closeDatabase().catch(() => {});
    database.dispose();
  }
}
