// The demo's geotagged photos: small invented leaf images made with jimp, EXIF GPS written with piexifjs,
// then sent through the same ingest service the upload API uses, so files land in uploads/ and sightings exist.
// North Creek 40 gets two-to-three tight soybean-aphid patches plus empty stops along a W walk; Schoolhouse
// Quarter gets gray leaf spot on an even jittered grid; Railside Strip gets four sightings. Seeded, so every run
// draws the same points.
import { booleanPointInPolygon } from '@turf/turf';
import { Jimp } from 'jimp';
import piexif from 'piexifjs';
import { createRandom, normalDeviate, type Random } from '../../shared/analysis/random.ts';
import type { Actor } from '../../server/auth/passport.ts';
import { ingestPhotos } from '../../server/services/ingest.ts';
import { recordEmptyStop } from '../../server/services/sightings.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { demoFields, demoUsers, type DemoField } from './demo-scenario.ts';
import type { DemoIds } from './seed-demo.ts';

const piexifTags = piexif.TAGS;
// OffsetTimeOriginal (0x9011, EXIF 2.31) is missing from piexifjs's tag table.
piexifTags.Exif[0x9011] ??= { name: 'OffsetTimeOriginal', type: 'Ascii' };

type Rational = [number, number];
function dms(decimal: number): [Rational, Rational, Rational] {
  const steps = Math.round(Math.abs(decimal) * 3600 * 1000);
  return [
    [Math.floor(steps / 3_600_000), 1],
    [Math.floor((steps % 3_600_000) / 60_000), 1],
    [steps % 60_000, 1000],
  ];
}

export interface Geotag {
  lon: number;
  lat: number;
  accuracyM?: number;
  altitudeM?: number;
  directionDeg?: number;
  /** 'YYYY:MM:DD HH:MM:SS' local time */
  takenAt: string;
  /** '+HH:MM' */
  offset: string;
}

/** Writes EXIF GPS (EXIF 2.32 / CIPA DC-008: DMS rationals with N/S, E/W refs) and the original time into a JPEG. */
export function geotag(jpeg: Buffer, tag: Geotag, thumbnail?: Buffer): Buffer {
  const G = piexif.GPSIFD;
  const gps: Record<number, unknown> = {
    [G.GPSVersionID]: [2, 3, 0, 0],
    [G.GPSLatitudeRef]: tag.lat < 0 ? 'S' : 'N',
    [G.GPSLatitude]: dms(tag.lat),
    [G.GPSLongitudeRef]: tag.lon < 0 ? 'W' : 'E',
    [G.GPSLongitude]: dms(tag.lon),
  };
  if (tag.altitudeM !== undefined) Object.assign(gps, { [G.GPSAltitudeRef]: 0, [G.GPSAltitude]: [Math.round(tag.altitudeM * 10), 10] });
  if (tag.accuracyM !== undefined) gps[G.GPSHPositioningError] = [Math.round(tag.accuracyM * 10), 10];
  if (tag.directionDeg !== undefined) Object.assign(gps, { [G.GPSImgDirectionRef]: 'T', [G.GPSImgDirection]: [Math.round(tag.directionDeg * 10), 10] });
  const dict: Record<string, unknown> = {
    '0th': { [piexif.ImageIFD.Make]: 'Patchwise demo camera', [piexif.ImageIFD.Orientation]: 1 },
    Exif: { [piexif.ExifIFD.DateTimeOriginal]: tag.takenAt, [0x9011]: tag.offset },
    GPS: gps,
  };
  if (thumbnail) {
    dict['1st'] = { [piexif.ImageIFD.Compression]: 6 };
    dict.thumbnail = thumbnail.toString('binary');
  }
  return Buffer.from(piexif.insert(piexif.dump(dict), jpeg.toString('binary')), 'binary');
}

/** A leaf on a green background with dark marks (aphids or lesions); a few variants are enough, EXIF makes each unique. */
export async function leafImage(random: Random, width = 640, height = 480, marks = 12) {
  const image = new Jimp({ width, height, color: 0x3f7a2aff });
  const cx = width / 2;
  const cy = height / 2;
  const rx = width * 0.38;
  const ry = height * 0.28;
  image.scan(0, 0, width, height, (x, y, idx) => {
    const d = ((x - cx) / rx) ** 2 + ((y - cy) / ry) ** 2;
    if (d <= 1) {
      image.bitmap.data[idx] = 96;
      image.bitmap.data[idx + 1] = 168 - Math.round(30 * d);
      image.bitmap.data[idx + 2] = 62;
    }
  });
  for (let m = 0; m < marks; m++) {
    const mx = Math.round(cx + (random() - 0.5) * rx * 1.4);
    const my = Math.round(cy + (random() - 0.5) * ry * 1.4);
    const r = 3 + Math.round(random() * 5);
    image.scan(Math.max(0, mx - r), Math.max(0, my - r), 2 * r, 2 * r, (x, y, idx) => {
      if ((x - mx) ** 2 + (y - my) ** 2 <= r * r) {
        image.bitmap.data[idx] = 52;
        image.bitmap.data[idx + 1] = 46;
        image.bitmap.data[idx + 2] = 24;
      }
    });
  }
  return image.getBuffer('image/jpeg', { quality: 78 });
}

// Local metres east/north of the field's south-west corner, the same flat-earth step the scenario's rectangles use.
function toLonLat(field: DemoField, x: number, y: number) {
  const [lon0, lat0] = field.boundary.coordinates[0][0][0];
  return { lon: lon0 + x / (111_320 * Math.cos((lat0 * Math.PI) / 180)), lat: lat0 + y / 111_320 };
}
const insideBoundary = (field: DemoField, p: { lon: number; lat: number }) =>
  booleanPointInPolygon([p.lon, p.lat], { type: 'MultiPolygon', coordinates: field.boundary.coordinates });

interface PlannedPhoto {
  x: number;
  y: number;
  count: number;
}

function patchyPlan(random: Random): PlannedPhoto[] {
  const patches = [
    { x: 150, y: 370, n: 24, sd: 16, peak: 420 },
    { x: 640, y: 120, n: 22, sd: 14, peak: 360 },
    { x: 560, y: 400, n: 14, sd: 12, peak: 260 },
  ];
  const plan: PlannedPhoto[] = [];
  for (const p of patches) {
    for (let i = 0; i < p.n; i++) {
      const dx = normalDeviate(random) * p.sd;
      const dy = normalDeviate(random) * p.sd;
      const falloff = Math.exp(-(dx * dx + dy * dy) / (2 * (p.sd * 1.5) ** 2));
      plan.push({ x: p.x + dx, y: p.y + dy, count: Math.max(5, Math.round(p.peak * falloff * (0.6 + 0.5 * random()))) });
    }
  }
  return plan;
}

/** Empty stops spread along a W walk across the field: common scouting practice (see the design's pest library notes). */
function wWalkStops(random: Random, widthM: number, heightM: number, stops: number) {
  const w = [
    [0.04, 0.94],
    [0.25, 0.06],
    [0.5, 0.8],
    [0.75, 0.06],
    [0.96, 0.94],
  ].map(([fx, fy]) => [fx * widthM, fy * heightM]);
  const legs = w.slice(1).map((b, i) => ({ a: w[i], b, length: Math.hypot(b[0] - w[i][0], b[1] - w[i][1]) }));
  const total = legs.reduce((s, l) => s + l.length, 0);
  const points: Array<{ x: number; y: number }> = [];
  for (let k = 0; k < stops; k++) {
    let along = ((k + 0.5) / stops) * total;
    const leg = legs.find((l) => (along <= l.length ? true : ((along -= l.length), false))) ?? legs[legs.length - 1];
    const t = Math.min(1, along / leg.length);
    points.push({ x: leg.a[0] + t * (leg.b[0] - leg.a[0]) + (random() - 0.5) * 8, y: leg.a[1] + t * (leg.b[1] - leg.a[1]) + (random() - 0.5) * 8 });
  }
  return points;
}

function evenPlan(random: Random): PlannedPhoto[] {
  const plan: PlannedPhoto[] = [];
  const cols = 7;
  const rows = 6;
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      if (plan.length >= 40) break;
      plan.push({
        x: ((c + 0.5) / cols) * 600 + (random() - 0.5) * 30,
        y: ((r + 0.5) / rows) * 600 + (random() - 0.5) * 30,
        count: 1 + Math.floor(random() * 6),
      });
    }
  }
  return plan;
}

const sparsePlan = (random: Random): PlannedPhoto[] =>
  [
    [120, 60],
    [380, 190],
    [610, 90],
    [820, 170],
  ].map(([x, y]) => ({ x: x + (random() - 0.5) * 20, y: y + (random() - 0.5) * 20, count: 2 + Math.floor(random() * 20) }));

/** Walk-day time of the index-th stop, two minutes apart from startMinutes after midnight. */
function timeOfDay(startMinutes: number, index: number) {
  const minutes = startMinutes + index * 2;
  const hh = String(Math.floor(minutes / 60)).padStart(2, '0');
  const mm = String(minutes % 60).padStart(2, '0');
  return `${hh}:${mm}:${String((index * 17) % 60).padStart(2, '0')}`;
}

/** EXIF DateTimeOriginal form ("YYYY:MM:DD hh:mm:ss"); the zone goes in OffsetTimeOriginal. */
const clock = (date: string, startMinutes: number, index: number) => `${date.replaceAll('-', ':')} ${timeOfDay(startMinutes, index)}`;

/** ISO 8601 with the walk's offset, as a phone sends an empty stop's time. */
const isoClock = (date: string, startMinutes: number, index: number, offset: string) => `${date}T${timeOfDay(startMinutes, index)}${offset}`;

const WALK_START_MINUTES = 9 * 60;
const WALK_OFFSET = '-05:00';

export async function seedPhotos(ids: DemoIds) {
  const started = Date.now();
  const random = createRandom('patchwise-demo-photos');
  const scout = demoUsers.find((u) => u.key === 'scout')!;
  const actor: Actor = { id: ids.users.scout, organisationId: ids.organisationId, role: 'scout', name: scout.name, email: scout.email };
  const bases = await Promise.all([0, 1, 2, 3].map(() => leafImage(random)));
  // Phones embed a small EXIF thumbnail; the demo's photos do too, so the thumbnail job takes its fast path.
  const embedded = await Promise.all(bases.map(async (b) => (await Jimp.read(b)).resize({ w: 240, h: 180 }).getBuffer('image/jpeg', { quality: 70 })));
  const field = (key: DemoField['key']) => demoFields.find((f) => f.key === key)!;
  const runs: Array<{ key: DemoField['key']; pest: string; date: string; plan: PlannedPhoto[] }> = [
    { key: 'patchy', pest: 'Soybean aphid', date: '2026-07-14', plan: patchyPlan(random) },
    { key: 'even', pest: 'Gray leaf spot', date: '2026-07-21', plan: evenPlan(random) },
    { key: 'sparse', pest: 'Soybean aphid', date: '2026-07-16', plan: sparsePlan(random) },
  ];
  let sightings = 0;
  let stops = 0;
  for (const run of runs) {
    let walkId: string | undefined;
    const f = field(run.key);
    const planned = run.plan.map((p) => ({ ...p, ...toLonLat(f, p.x, p.y) })).filter((p) => insideBoundary(f, p));
    const photos = planned.map((p, i) => ({
      fileName: `${run.key}-${String(i + 1).padStart(3, '0')}.jpg`,
      count: p.count,
      bytes: geotag(
        bases[i % bases.length],
        {
          lon: p.lon,
          lat: p.lat,
          accuracyM: 3 + Math.round(random() * 40) / 10,
          altitudeM: 540 + random() * 6,
          directionDeg: Math.floor(random() * 360),
          takenAt: clock(run.date, WALK_START_MINUTES, i),
          offset: WALK_OFFSET,
        },
        embedded[i % bases.length],
      ),
    }));
    for (let i = 0; i < photos.length; i += 20) {
      const results = await ingestPhotos(actor, { pestId: ids.pests[run.pest], fieldId: ids.fields[run.key] }, photos.slice(i, i + 20));
      for (const r of results) {
        if (r.outcome !== 'placed') throw new Error(`demo photo ${r.fileName} was not placed: ${r.message}`);
        walkId ??= r.walkId;
        sightings++;
      }
    }
    if (run.key === 'patchy' && walkId) {
      // Enough empty stops along the walk that the patches hold under half of all stops: a patchy field, not "everywhere".
      // They are recorded on the walk day after the photos (each at its own time), as a scout's phone would send them.
      const emptyStops = wWalkStops(random, 800, 500, 90)
        .map((s) => toLonLat(f, s.x, s.y))
        .filter((p) => insideBoundary(f, p));
      for (const [i, stop] of emptyStops.entries()) {
        stops++;
        const observedAt = isoClock(run.date, WALK_START_MINUTES + photos.length * 2, i + 1, WALK_OFFSET);
        await recordEmptyStop(actor, walkId, { pestId: ids.pests[run.pest], ...stop, accuracyM: 4 + Math.round(random() * 30) / 10, observedAt });
      }
    }
  }
  // Thumbnails are queued by the ingest like any upload; the server's workers make them when it starts.
  await stopQueue();
  return { sightings, stops, seconds: (Date.now() - started) / 1000 };
}
