// Real JPEGs with known EXIF, made with jimp (pixels) and piexifjs (EXIF), for tests and other engineers.
// GPS tags follow EXIF 2.32 / CIPA DC-008-2019 §4.6.6: GPSLatitude and GPSLongitude are three RATIONALs
// (degrees, minutes, seconds) with GPSLatitudeRef 'N'/'S' and GPSLongitudeRef 'E'/'W' carrying the sign.
import { Jimp } from 'jimp';
import piexif from 'piexifjs';
import fs from 'node:fs';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { signedIn, type Client } from './http.ts';
import { makeOrganisation, type TestOrganisation } from './org.ts';
import { createFarm, createField, createPest } from './farm-records.ts';
import { degreeRectangle } from './boundary-shapes.ts';

// OffsetTimeOriginal (0x9011) arrived in EXIF 2.31, after piexifjs's tag table was written; add it here.
const piexifTags = (piexif as unknown as { TAGS: Record<string, Record<number, { name: string; type: string }>> }).TAGS;
piexifTags.Exif[0x9011] ??= { name: 'OffsetTimeOriginal', type: 'Ascii' };

export type Rational = [number, number];

/** Degrees as DMS rationals: whole degrees, whole minutes, seconds with `secondsDenominator` precision. */
export function toDmsRationals(decimalDegrees: number, secondsDenominator = 10_000): [Rational, Rational, Rational] {
  // Work in whole units of the smallest step so rounding carries into minutes and degrees (never 60″).
  const steps = Math.round(Math.abs(decimalDegrees) * 3600 * secondsDenominator);
  const perMinute = 60 * secondsDenominator;
  const perDegree = 60 * perMinute;
  const degrees = Math.floor(steps / perDegree);
  const minutes = Math.floor((steps % perDegree) / perMinute);
  const seconds = steps % perMinute;
  return [
    [degrees, 1],
    [minutes, 1],
    [seconds, secondsDenominator],
  ];
}

/** The decimal degrees that DMS rationals stand for (what a correct reader must return, before the sign). */
export const fromDmsRationals = (dms: [Rational, Rational, Rational]) => dms[0][0] / dms[0][1] + dms[1][0] / dms[1][1] / 60 + dms[2][0] / dms[2][1] / 3600;

export interface PhotoExif {
  /** WGS 84 position; omitted means no GPS block at all. */
  gps?: { lat: number; lon: number; altitudeM?: number; accuracyM?: number; directionDeg?: number };
  /** Raw GPS rationals, written as given (for (0,0) or out-of-range values). */
  rawGps?: { lat: [Rational, Rational, Rational]; latRef: string; lon: [Rational, Rational, Rational]; lonRef: string };
  /** 'YYYY:MM:DD HH:MM:SS' local time, as cameras write DateTimeOriginal. */
  dateTimeOriginal?: string;
  /** '+HH:MM' / '-HH:MM' */
  offsetTimeOriginal?: string;
  /** EXIF Orientation 1–8 (TIFF 6.0 tag 274). */
  orientation?: number;
  /** Embed an EXIF thumbnail (IFD1, JPEG) of this width, same aspect as the photo. */
  embeddedThumbnailWidth?: number;
}

export interface PhotoOptions extends PhotoExif {
  width?: number;
  height?: number;
  /** 0xRRGGBBAA background; a leaf green by default. */
  background?: number;
  /** Draw a dark blob so photos differ in bytes; the seed makes every photo unique. */
  markSeed?: number;
  quality?: number;
}

function gpsIfd(exif: PhotoExif): Record<number, unknown> {
  const G = piexif.GPSIFD;
  if (exif.rawGps) {
    return {
      [G.GPSVersionID]: [2, 3, 0, 0],
      [G.GPSLatitudeRef]: exif.rawGps.latRef,
      [G.GPSLatitude]: exif.rawGps.lat,
      [G.GPSLongitudeRef]: exif.rawGps.lonRef,
      [G.GPSLongitude]: exif.rawGps.lon,
    };
  }
  if (!exif.gps) return {};
  const { lat, lon, altitudeM, accuracyM, directionDeg } = exif.gps;
  const ifd: Record<number, unknown> = {
    [G.GPSVersionID]: [2, 3, 0, 0],
    [G.GPSLatitudeRef]: lat < 0 ? 'S' : 'N',
    [G.GPSLatitude]: toDmsRationals(lat),
    [G.GPSLongitudeRef]: lon < 0 ? 'W' : 'E',
    [G.GPSLongitude]: toDmsRationals(lon),
  };
  if (altitudeM !== undefined) {
    ifd[G.GPSAltitudeRef] = altitudeM < 0 ? 1 : 0;
    ifd[G.GPSAltitude] = [Math.round(Math.abs(altitudeM) * 100), 100];
  }
  if (accuracyM !== undefined) ifd[G.GPSHPositioningError] = [Math.round(accuracyM * 100), 100];
  if (directionDeg !== undefined) {
    ifd[G.GPSImgDirectionRef] = 'T';
    ifd[G.GPSImgDirection] = [Math.round(directionDeg * 100), 100];
  }
  return ifd;
}

/** Writes EXIF into a JPEG (replacing any APP1 EXIF it has). */
export async function withExif(jpeg: Buffer, exif: PhotoExif, size?: { width: number; height: number }): Promise<Buffer> {
  const zeroth: Record<number, unknown> = { [piexif.ImageIFD.Make]: 'Patchwise test camera' };
  if (exif.orientation) zeroth[piexif.ImageIFD.Orientation] = exif.orientation;
  const exifIfd: Record<number, unknown> = {};
  if (exif.dateTimeOriginal) exifIfd[piexif.ExifIFD.DateTimeOriginal] = exif.dateTimeOriginal;
  if (exif.offsetTimeOriginal) exifIfd[0x9011] = exif.offsetTimeOriginal;
  const dict: Record<string, unknown> = { '0th': zeroth, Exif: exifIfd, GPS: gpsIfd(exif) };
  if (exif.embeddedThumbnailWidth && size) {
    const w = exif.embeddedThumbnailWidth;
    const h = Math.round((w * size.height) / size.width);
    const small = (await Jimp.read(jpeg)).resize({ w, h });
    const thumb = await small.getBuffer('image/jpeg', { quality: 70 });
    dict['1st'] = { [piexif.ImageIFD.Compression]: 6 };
    dict.thumbnail = thumb.toString('binary');
  }
  const bytes = piexif.dump(dict);
  return Buffer.from(piexif.insert(bytes, jpeg.toString('binary')), 'binary');
}

/** A JPEG of a leaf with a mark on it, carrying the EXIF asked for. */
export async function makeJpeg(options: PhotoOptions = {}): Promise<Buffer> {
  const width = options.width ?? 320;
  const height = options.height ?? 240;
  const image = new Jimp({ width, height, color: options.background ?? 0x4f8a2bff });
  const seed = options.markSeed ?? Math.floor(Math.random() * 1e9);
  // A dark blob whose place depends on the seed, so two photos never share bytes (and SHA-256) by accident.
  const cx = 10 + (seed % Math.max(1, width - 20));
  const cy = 10 + (Math.floor(seed / 7) % Math.max(1, height - 20));
  const r = Math.max(3, Math.round(Math.min(width, height) / 12));
  image.scan(Math.max(0, cx - r), Math.max(0, cy - r), Math.min(2 * r, width - cx + r), Math.min(2 * r, height - cy + r), (x, y, idx) => {
    if ((x - cx) ** 2 + (y - cy) ** 2 <= r * r) {
      image.bitmap.data[idx] = 40;
      image.bitmap.data[idx + 1] = 30;
      image.bitmap.data[idx + 2] = 20;
    }
  });
  const jpeg = await image.getBuffer('image/jpeg', { quality: options.quality ?? 80 });
  return withExif(jpeg, options, { width, height });
}

/** The raw EXIF (APP1 payload, starting "Exif\0\0") of a JPEG, for a second reader such as exif-reader. */
export function app1Exif(jpeg: Buffer): Buffer | null {
  let offset = 2;
  while (offset + 4 <= jpeg.length && jpeg[offset] === 0xff) {
    const marker = jpeg[offset + 1];
    const length = jpeg.readUInt16BE(offset + 2);
    if (marker === 0xe1 && jpeg.toString('ascii', offset + 4, offset + 8) === 'Exif') return jpeg.subarray(offset + 4, offset + 2 + length);
    if (marker === 0xda) break;
    offset += 2 + length;
  }
  return null;
}

// Upload-side helpers for API tests: a field in the southern/western hemisphere with an assigned scout,
// multipart uploads like the scout's phone makes, and counts of what the database and disk hold.
export interface UploadPhoto {
  bytes: Buffer;
  name?: string;
}

/** POST /api/photos as multipart/form-data, the way the scout's screen sends it. */
export function uploadPhotos(client: Client, photos: UploadPhoto[], fields: Record<string, string | number | undefined>) {
  let req = client.agent.post('/api/photos').set('x-csrf-token', client.csrf);
  for (const [key, value] of Object.entries(fields)) if (value !== undefined) req = req.field(key, String(value));
  photos.forEach((p, i) => {
    req = req.attach('photos', p.bytes, { filename: p.name ?? `photo-${i}.jpg`, contentType: 'image/jpeg' });
  });
  return req;
}

export async function rowCounts(organisationId: string) {
  const [row] = await sequelize.query<{ photos: number; sightings: number; walks: number }>(
    `SELECT (SELECT count(*)::int FROM photos WHERE organisation_id = :org) AS photos,
            (SELECT count(*)::int FROM sightings WHERE organisation_id = :org) AS sightings,
            (SELECT count(*)::int FROM walks WHERE organisation_id = :org) AS walks`,
    { replacements: { org: organisationId }, type: QueryTypes.SELECT },
  );
  return row;
}

/** Every file anywhere under the upload folder (relative paths), sorted. */
export function uploadedFiles(): string[] {
  const root = process.env.UPLOAD_DIR ?? path.resolve('uploads');
  if (!fs.existsSync(root)) return [];
  return (fs.readdirSync(root, { recursive: true, withFileTypes: true }) as fs.Dirent[])
    .filter((e) => e.isFile())
    .map((e) => path.relative(root, path.join(e.parentPath ?? (e as unknown as { path: string }).path, e.name)))
    .sort();
}

/** A field near (−34.6, −58.9): south of the equator and west of Greenwich, so both signs are negative. */
export const SOUTH_WEST_ORIGIN = { lon: -58.905, lat: -34.605 } as const;

export interface ScoutingSetUp {
  org: TestOrganisation;
  admin: Client;
  scout: Client;
  field: { id: string; name: string };
  otherField: { id: string; name: string };
  pest: { id: string; name: string };
}

/** An organisation with two fields side by side (about 900 m × 1100 m each); the scout is assigned to the first only. */
export async function scoutingSetUp(): Promise<ScoutingSetUp> {
  const org = await makeOrganisation('Upload');
  const admin = await signedIn(org.users.admin.email);
  const farm = await createFarm(admin);
  const field = await createField(admin, farm.id, degreeRectangle(SOUTH_WEST_ORIGIN.lon, SOUTH_WEST_ORIGIN.lat, 0.01, 0.01));
  const otherField = await createField(admin, farm.id, degreeRectangle(SOUTH_WEST_ORIGIN.lon + 0.02, SOUTH_WEST_ORIGIN.lat, 0.01, 0.01));
  await admin.post(`/api/fields/${field.id}/scouts`, { userId: org.users.scout.id }).expect(204);
  const pest = await createPest(admin);
  const scout = await signedIn(org.users.scout.email);
  return { org, admin, scout, field, otherField, pest };
}

/** A point inside the first field, as fractions of its width and height. */
export const insideField = (fx = 0.5, fy = 0.5) => ({ lon: SOUTH_WEST_ORIGIN.lon + 0.01 * fx, lat: SOUTH_WEST_ORIGIN.lat + 0.01 * fy });
