// Photo ingest benchmark: N generated 4000 × 3000 JPEGs with GPS sent through the real upload API (multer,
// EXIF, PostGIS, storage) into a throwaway PostgreSQL cluster, thumbnails made by the pg-boss worker in
// worker threads, while a simple API read is timed; against a plain jimp read → resize → write pipeline.
// BENCH_INGEST_PHOTOS sets N (default 100 to stay within about three minutes on 2 cores; the figure is 200);
// the table prints the count used.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import type { AddressInfo } from 'node:net';
import { Worker } from 'node:worker_threads';
import { Jimp } from 'jimp';
import { clusterFor, databaseUrl, ensureDatabase, initCluster, startCluster, stopCluster } from '../lib/postgres.ts';
import { freePort } from '../lib/free-port.ts';
import { projectRoot } from '../lib/local-env.ts';
import type { BenchTable } from './table.ts';

const WIDTH = 4000;
const HEIGHT = 3000;
const BATCH = 20;
const FIELD_SW = { lon: -96.71, lat: 40.81 };
const PASSWORD = 'bench-password-not-secret';

// Plain JavaScript run in a worker thread: sends the photos in batches like the scout's screen, counts 'placed'.
const UPLOADER = `
const { workerData, parentPort } = require('node:worker_threads');
const fs = require('node:fs');
const path = require('node:path');
(async () => {
  const { base, cookie, csrf, pestId, photoDir, batch } = workerData;
  const files = fs.readdirSync(photoDir).sort();
  let placed = 0;
  for (let i = 0; i < files.length; i += batch) {
    const form = new FormData();
    form.set('pestId', pestId);
    form.set('count', '3');
    for (const name of files.slice(i, i + batch)) form.append('photos', new Blob([fs.readFileSync(path.join(photoDir, name))], { type: 'image/jpeg' }), name);
    const res = await fetch(base + '/api/photos', { method: 'POST', headers: { cookie, 'x-csrf-token': csrf }, body: form });
    const body = await res.json();
    placed += (body.results || []).filter((r) => r.outcome === 'placed').length;
  }
  parentPort.postMessage(placed);
})();
`;

const percentile = (values: number[], p: number) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] ?? 0;
};
const round = (n: number, digits = 2) => Math.round(n * 10 ** digits) / 10 ** digits;

/** One 12 MP leaf photo with texture (so it compresses like a real one), plus its small EXIF thumbnail. */
async function basePhoto() {
  const image = new Jimp({ width: WIDTH, height: HEIGHT, color: 0x3f7a2aff });
  let state = 12345;
  const data = image.bitmap.data;
  for (let i = 0; i < data.length; i += 4) {
    state = (state * 1103515245 + 12345) >>> 0;
    const n = (state >>> 24) - 128;
    data[i] = Math.max(0, Math.min(255, data[i] + (n >> 3)));
    data[i + 1] = Math.max(0, Math.min(255, data[i + 1] + (n >> 2)));
  }
  const jpeg = await image.getBuffer('image/jpeg', { quality: 85 });
  const thumbnail = await image.resize({ w: 320, h: 240 }).getBuffer('image/jpeg', { quality: 70 });
  return { jpeg, thumbnail };
}

interface Session {
  base: string;
  cookie: string;
  csrf: string;
}

async function signIn(base: string, email: string): Promise<Session> {
  const first = await fetch(`${base}/api/auth/csrf`);
  let cookie = (first.headers.get('set-cookie') ?? '').split(';')[0];
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { cookie, 'x-csrf-token': csrfToken, 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: PASSWORD }),
  });
  if (res.status !== 200) throw new Error(`bench sign-in failed: ${res.status}`);
  cookie = (res.headers.get('set-cookie') ?? cookie).split(';')[0];
  return { base, cookie, csrf: ((await res.json()) as { csrfToken: string }).csrfToken };
}

/**
 * Runs the measurement in a child process: server modules bind their database on import, and other benches in the
 * same runner may already have bound theirs.
 */
export async function run(): Promise<BenchTable> {
  const child = spawnSync('node', ['--import', 'tsx', 'scripts/bench/ingest.ts'], {
    cwd: projectRoot,
    env: { ...process.env, PATCHWISE_INGEST_BENCH_CHILD: '1' },
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'inherit'],
    maxBuffer: 16 * 1024 * 1024,
  });
  const last = child.stdout.trim().split('\n').pop() ?? '';
  if (child.status !== 0 || !last.startsWith('{')) throw new Error(`the ingest bench failed (exit ${child.status}): ${child.stdout.slice(-500)}`);
  return JSON.parse(last) as BenchTable;
}

async function measure(): Promise<BenchTable> {
  const count = Math.max(BATCH, Number(process.env.BENCH_INGEST_PHOTOS ?? 100));
  const workDir = fs.mkdtempSync(path.join(os.tmpdir(), 'patchwise-bench-ingest-'));
  fs.chmodSync(workDir, 0o755);
  const cluster = clusterFor(path.join(workDir, 'postgres'), await freePort());
  const cleanUps: Array<() => Promise<unknown> | unknown> = [];
  try {
    initCluster(cluster);
    startCluster(cluster);
    await ensureDatabase(cluster, 'patchwise_bench');
    Object.assign(process.env, {
      DATABASE_URL: databaseUrl(cluster, 'patchwise_bench'),
      UPLOAD_DIR: path.join(workDir, 'uploads'),
      NODE_ENV: 'test',
      MAIL_CATCHER: 'off',
    });
    const migrate = spawnSync('node', ['--import', 'tsx', 'scripts/migrate.ts'], {
      cwd: projectRoot,
      env: process.env,
      stdio: ['ignore', 'ignore', 'inherit'],
    });
    if (migrate.status !== 0) throw new Error('migrations failed');

    // Server modules read their configuration on import: load them only now.
    const { config } = await import('../../server/config.ts');
    if (config.databaseUrl !== process.env.DATABASE_URL)
      throw new Error('server configuration was loaded before the bench set its database; run this bench on its own');
    const { sequelize } = await import('../../server/db.ts');
    const { createApp } = await import('../../server/app.ts');
    const { hashPassword } = await import('../../server/auth/passwords.ts');
    const { startWorkers } = await import('../../server/jobs/workers.ts');
    const { stopQueue } = await import('../../server/jobs/queue.ts');
    await import('../../server/jobs/thumbnail-worker.ts');
    const { renderInPool, closeThumbnailPool, thumbnailThreads } = await import('../../server/services/thumbnail-pool.ts');
    const { geotag } = await import('../seed/seed-photos.ts');
    cleanUps.push(
      () => sequelize.close(),
      () => closeThumbnailPool(),
      () => stopQueue(),
    );

    // An organisation with one 2 km × 2 km field and its scout.
    const passwordHash = await hashPassword(PASSWORD);
    const q = <T extends object>(sql: string, replacements: Record<string, unknown>) => sequelize.query<T>(sql, { replacements, type: 'SELECT' as never });
    const [org] = await q<{ id: string }>(`INSERT INTO organisations (name) VALUES ('Bench advisory') RETURNING id`, {});
    const [scout] = await q<{ id: string }>(
      `INSERT INTO users (organisation_id, name, email, role, password_hash) VALUES (:org, 'Bench scout', 'scout@bench.example', 'scout', :passwordHash) RETURNING id`,
      { org: org.id, passwordHash },
    );
    const [farm] = await q<{ id: string }>(`INSERT INTO farms (organisation_id, name) VALUES (:org, 'Bench farm') RETURNING id`, { org: org.id });
    const ring = [
      [0, 0],
      [0.024, 0],
      [0.024, 0.018],
      [0, 0.018],
      [0, 0],
    ].map(([dx, dy]) => [FIELD_SW.lon + dx, FIELD_SW.lat + dy]);
    const [field] = await q<{ id: string }>(
      `INSERT INTO fields (organisation_id, farm_id, name, crop, season, boundary) VALUES (:org, :farm, 'Bench field', 'soybean', 2026, ST_Multi(ST_SetSRID(ST_GeomFromGeoJSON(:geojson), 4326))) RETURNING id`,
      { org: org.id, farm: farm.id, geojson: JSON.stringify({ type: 'Polygon', coordinates: [ring] }) },
    );
    await q(`INSERT INTO field_assignments (field_id, user_id) VALUES (:field, :scout) RETURNING field_id`, { field: field.id, scout: scout.id });
    const [pest] = await q<{ id: string }>(
      `INSERT INTO pests (organisation_id, name, kind, count_unit, action_threshold, threshold_source) VALUES (:org, 'Bench aphid', 'insect', 'aphids per plant', 250, 'bench only') RETURNING id`,
      { org: org.id },
    );

    console.error(`ingest bench: generating ${count} photos of ${WIDTH} × ${HEIGHT}…`);
    const { jpeg, thumbnail } = await basePhoto();
    // One picture, many positions: each photo's EXIF (and so its SHA-256) differs, as in a real walk.
    const photoAt = (i: number, withThumbnail: boolean) =>
      geotag(
        jpeg,
        {
          lon: FIELD_SW.lon + 0.001 + ((i * 37) % 220) * 0.0001,
          lat: FIELD_SW.lat + 0.001 + Math.floor(i / 7) * 0.00008,
          accuracyM: 4,
          takenAt: `2026:07:14 ${String(8 + Math.floor(i / 60)).padStart(2, '0')}:${String(i % 60).padStart(2, '0')}:00`,
          offset: '-05:00',
        },
        withThumbnail ? thumbnail : undefined,
      );
    const photos = Array.from({ length: count }, (_, i) => photoAt(i, true));

    const app = createApp({ clientDir: path.join(workDir, 'no-client') });
    const server = app.listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    cleanUps.unshift(() => new Promise((resolve) => server.close(resolve)));
    const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    const session = await signIn(base, 'scout@bench.example');
    await startWorkers();

    // A simple read, timed all through ingestion.
    const latencies: number[] = [];
    let reading = true;
    let failedReads = 0;
    const reader = (async () => {
      while (reading) {
        const t = performance.now();
        // A reset connection counts as a read that took as long as it did; the loop goes on.
        await fetch(`${base}/api/walks?fieldId=${field.id}`, { headers: { cookie: session.cookie } })
          .then((res) => res.arrayBuffer())
          .catch(() => (failedReads += 1));
        latencies.push(performance.now() - t);
        await new Promise((r) => setTimeout(r, 25));
      }
    })();

    const readyCount = async () => (await q<{ n: number }>(`SELECT count(*)::int AS n FROM photos WHERE thumbnail_status <> 'pending'`, {}))[0].n;
    // The phones' side runs in its own thread, so its multipart encoding does not share the server's event loop.
    const photoDir = path.join(workDir, 'outgoing');
    fs.mkdirSync(photoDir);
    photos.forEach((bytes, i) => fs.writeFileSync(path.join(photoDir, `bench-${String(i).padStart(4, '0')}.jpg`), bytes));
    const started = performance.now();
    const placed = await new Promise<number>((resolve, reject) => {
      const uploader = new Worker(UPLOADER, {
        eval: true,
        workerData: { base, cookie: session.cookie, csrf: session.csrf, pestId: pest.id, photoDir, batch: BATCH },
      });
      uploader.once('message', resolve);
      uploader.once('error', reject);
    });
    const placedSeconds = (performance.now() - started) / 1000;
    // Thumbnails get up to a minute after the last upload answers.
    const waitUntil = performance.now() + 60_000;
    while ((await readyCount()) < count && performance.now() < waitUntil) await new Promise((r) => setTimeout(r, 200));
    const thumbnails = await readyCount();
    const readySeconds = (performance.now() - started) / 1000;
    reading = false;
    await reader;
    const [{ failed }] = await q<{ failed: number }>(`SELECT count(*) FILTER (WHERE thumbnail_status = 'failed')::int AS failed FROM photos`, {});

    // The decode path alone (photos without an embedded thumbnail), through the same worker threads.
    const decodeSample = Array.from({ length: Math.min(10, count) }, (_, i) => photoAt(count + i, false));
    const decodeStart = performance.now();
    const threads = Math.max(1, thumbnailThreads());
    for (let i = 0; i < decodeSample.length; i += threads) {
      await Promise.all(decodeSample.slice(i, i + threads).map((bytes) => renderInPool({ bytes, mimeType: 'image/jpeg', orientation: 1 })));
    }
    const decodeRate = decodeSample.length / ((performance.now() - decodeStart) / 1000);

    // Plain jimp read → resize → write, one photo after another, on the same photos.
    const plainSample = photos.slice(0, 3);
    const plainDir = path.join(workDir, 'plain');
    fs.mkdirSync(plainDir);
    const plainStart = performance.now();
    for (const [i, bytes] of plainSample.entries()) {
      const image = await Jimp.read(bytes);
      image.resize({ w: 320, h: 240 });
      fs.writeFileSync(path.join(plainDir, `${i}.jpg`), await image.getBuffer('image/jpeg'));
    }
    const plainRate = plainSample.length / ((performance.now() - plainStart) / 1000);
    const thumbnailRate = thumbnails / readySeconds;

    return {
      title: `Photo ingest: ${count} photos of ${WIDTH} × ${HEIGHT} (${round(jpeg.length / 1e6, 1)} MB each) through POST /api/photos, ${threads} thumbnail threads`,
      rows: [
        { measure: 'photos placed', value: placed, note: `of ${count}` },
        {
          measure: 'photos/s to placed',
          value: round(placed / placedSeconds),
          note: `${round(placedSeconds, 1)} s for the batch; each photo is placed when its request answers`,
        },
        {
          measure: 'photos/s to thumbnail ready',
          value: round(thumbnailRate),
          note: `${thumbnails} ready (${failed} failed) ${round(readySeconds, 1)} s after the first upload; target ≥ 5`,
        },
        {
          measure: 'thumbnails/s, full decode path (no EXIF thumbnail)',
          value: round(decodeRate),
          note: `${decodeSample.length} photos, mozjpeg (@jsquash/jpeg) → jimp`,
        },
        { measure: 'photos/s, plain jimp read → resize → write', value: round(plainRate, 3), note: `${plainSample.length} photos, one thread` },
        {
          measure: 'thumbnail pipeline ÷ plain jimp',
          value: round(thumbnailRate / plainRate, 1),
          note: `full decode path: ${round(decodeRate / plainRate, 1)}×; target ≥ 4×`,
        },
        {
          measure: 'p95 GET /api/walks during ingestion (ms)',
          value: round(percentile(latencies, 95), 1),
          note: `${latencies.length} reads (${failedReads} failed), median ${round(percentile(latencies, 50), 1)} ms, max ${round(Math.max(...latencies), 1)} ms; target < 100`,
        },
      ],
    };
  } finally {
    for (const cleanUp of cleanUps) await Promise.resolve(cleanUp()).catch(() => {});
    stopCluster(cluster);
    fs.rmSync(workDir, { recursive: true, force: true });
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  if (process.env.PATCHWISE_INGEST_BENCH_CHILD === '1') {
    console.log(JSON.stringify(await measure()));
  } else {
    const table = await run();
    console.log(table.title);
    console.table(table.rows);
  }
  process.exit(0);
}
