// Reads what a photo says about where and when it was taken (exifr), and judges whether to trust it.
// GPS tags per EXIF 2.32 / CIPA DC-008: latitude/longitude as DMS rationals, the sign in the N/S/E/W refs.
import exifr from 'exifr';
import { heifExifTiff } from './heif-exif.ts';
import { asSource, type PhotoSource } from './photo-source.ts';
import type { Position, TimeFlag } from '../../shared/schemas/sightings.ts';

export type PositionProblem = 'missing' | 'null-island' | 'out-of-range' | 'no-reference';

export interface PhotoReading {
  position: Position | null;
  positionProblem: PositionProblem | null;
  altitudeM: number | null;
  accuracyM: number | null;
  directionDeg: number | null;
  observedAt: Date | null;
  /** The calendar date where the photo was taken (YYYY-MM-DD), when the time is trusted. */
  localDate: string | null;
  timeFlag: TimeFlag | null;
  /** EXIF Orientation 1–8 (TIFF 6.0 tag 274). */
  orientation: number;
  /** The tags kept with the photo, as read. */
  kept: Record<string, unknown>;
}

const DAY_MS = 86_400_000;
/** A camera clock more than a day ahead is wrong; older than two years is not this season's walk. */
export const FUTURE_TOLERANCE_MS = DAY_MS;
export const OLD_LIMIT_MS = 2 * 365.25 * DAY_MS;

const keptTags = [
  'Make',
  'Model',
  'Orientation',
  'DateTimeOriginal',
  'OffsetTimeOriginal',
  'GPSLatitudeRef',
  'GPSLatitude',
  'GPSLongitudeRef',
  'GPSLongitude',
  'GPSAltitudeRef',
  'GPSAltitude',
  'GPSHPositioningError',
  'GPSImgDirectionRef',
  'GPSImgDirection',
  'GPSDateStamp',
  'GPSTimeStamp',
  'ImageWidth',
  'ImageHeight',
  'ExifImageWidth',
  'ExifImageHeight',
] as const;

type Dms = number[];
const asNumber = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : null);
const firstNumber = (v: unknown) => asNumber(Array.isArray(v) || ArrayBuffer.isView(v) ? (v as ArrayLike<number>)[0] : v);

function decimalFromDms(dms: unknown): number | null {
  if (typeof dms === 'number') return Number.isFinite(dms) ? dms : null;
  if (!Array.isArray(dms) || dms.length === 0) return null;
  const [d, m = 0, s = 0] = dms as Dms;
  if (![d, m, s].every((n) => typeof n === 'number' && Number.isFinite(n) && n >= 0)) return null;
  if (m >= 60 || s >= 60) return Number.NaN;
  return d + m / 60 + s / 3600;
}

function readPosition(tags: Record<string, unknown>): { position: Position | null; problem: PositionProblem | null } {
  const latAbs = decimalFromDms(tags.GPSLatitude);
  const lonAbs = decimalFromDms(tags.GPSLongitude);
  if (latAbs === null || lonAbs === null) return { position: null, problem: 'missing' };
  const latRef = String(tags.GPSLatitudeRef ?? '')
    .trim()
    .toUpperCase();
  const lonRef = String(tags.GPSLongitudeRef ?? '')
    .trim()
    .toUpperCase();
  if (!['N', 'S'].includes(latRef) || !['E', 'W'].includes(lonRef)) return { position: null, problem: 'no-reference' };
  const lat = latRef === 'S' ? -latAbs : latAbs;
  const lon = lonRef === 'W' ? -lonAbs : lonAbs;
  if (!Number.isFinite(lat) || !Number.isFinite(lon) || Math.abs(lat) > 90 || Math.abs(lon) > 180) return { position: null, problem: 'out-of-range' };
  // (0, 0) is what many devices write when they had no fix.
  if (Math.abs(lat) < 1e-7 && Math.abs(lon) < 1e-7) return { position: null, problem: 'null-island' };
  return { position: { lon, lat }, problem: null };
}

const exifDateTime = /^(\d{4}):(\d{2}):(\d{2})[ T](\d{2}):(\d{2}):(\d{2})/;
const offsetPattern = /^([+-])(\d{2}):?(\d{2})$/;

function readTime(tags: Record<string, unknown>, position: Position | null, now: Date) {
  const match = exifDateTime.exec(String(tags.DateTimeOriginal ?? ''));
  if (!match) return { observedAt: null, localDate: null, timeFlag: 'missing' as TimeFlag };
  const [, y, mo, d, h, mi, s] = match.map(Number);
  const wallClockAsUtc = Date.UTC(y, mo - 1, d, h, mi, s);
  if (Number.isNaN(wallClockAsUtc) || mo < 1 || mo > 12 || d < 1 || d > 31) return { observedAt: null, localDate: null, timeFlag: 'missing' as TimeFlag };
  let instant: number;
  const offset = offsetPattern.exec(String(tags.OffsetTimeOriginal ?? '').trim());
  const gpsDate = /^(\d{4}):(\d{2}):(\d{2})$/.exec(String(tags.GPSDateStamp ?? ''));
  const gpsTime = Array.isArray(tags.GPSTimeStamp) ? (tags.GPSTimeStamp as number[]) : null;
  if (offset) {
    const minutes = (Number(offset[2]) * 60 + Number(offset[3])) * (offset[1] === '-' ? -1 : 1);
    instant = wallClockAsUtc - minutes * 60_000;
  } else if (gpsDate && gpsTime?.length === 3) {
    // GPSDateStamp/GPSTimeStamp are UTC by definition (EXIF 2.32 §4.6.6).
    instant = Date.UTC(Number(gpsDate[1]), Number(gpsDate[2]) - 1, Number(gpsDate[3])) + ((gpsTime[0] * 60 + gpsTime[1]) * 60 + gpsTime[2]) * 1000;
  } else {
    // No offset recorded: estimate it from the longitude (15° per hour, common practice); UTC without a position.
    const hours = position ? Math.round(position.lon / 15) : 0;
    instant = wallClockAsUtc - hours * 3_600_000;
  }
  const observedAt = new Date(instant);
  const localDate = `${match[1]}-${match[2]}-${match[3]}`;
  if (instant > now.getTime() + FUTURE_TOLERANCE_MS) return { observedAt, localDate: null, timeFlag: 'future' as TimeFlag };
  if (instant < now.getTime() - OLD_LIMIT_MS) return { observedAt, localDate: null, timeFlag: 'old' as TimeFlag };
  return { observedAt, localDate, timeFlag: null };
}

function plain(value: unknown): unknown {
  if (ArrayBuffer.isView(value)) return Array.from(value as unknown as ArrayLike<number>);
  if (value instanceof Date) return value.toISOString();
  return value;
}

/**
 * One object for every read: exifr keeps the Options it builds from each options object in a Map for the
 * process's life (Options.useCached), so a fresh literal per photo kept about 7 KB per upload for good (load bench).
 */
const exifrOptions = {
  tiff: true,
  exif: true,
  gps: true,
  ifd1: false,
  xmp: false,
  icc: false,
  iptc: false,
  jfif: false,
  ihdr: false,
  translateKeys: true,
  translateValues: false,
  reviveValues: false,
  mergeOutput: true,
};

/** The same options for a spooled file, read in bounded chunks by exifr's own file reader (one object, as above). */
const exifrFileOptions = { ...exifrOptions, chunked: true };

const asBuffer = (bytes: Uint8Array) => Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);

/** The tags of a photo, read from its head or its file in chunks: the whole file is never in memory for this. */
async function readTags(source: PhotoSource): Promise<Record<string, unknown>> {
  // A HEIF photo's Exif block is found by a full box parser first; exifr then reads it as the TIFF it is.
  const heifTiff = await heifExifTiff(source);
  if (heifTiff) return (await exifr.parse(asBuffer(heifTiff), exifrOptions)) ?? {};
  // Bytes already in memory (the seed) are read whole, as they are.
  if (!source.file) return (await exifr.parse(asBuffer(source.body as Uint8Array), exifrOptions)) ?? {};
  // A JPEG's APP1 Exif segment follows the start of image, well within the head.
  const fromHead = (await exifr.parse(asBuffer(source.head), exifrOptions).catch(() => undefined)) ?? {};
  if (Object.keys(fromHead).length > 0 || source.head.length >= source.size) return fromHead;
  // Metadata further in (a PNG's eXIf chunk, unusual JPEG layouts): exifr reads the file in chunks until it finds it.
  return (await exifr.parse(source.file, exifrFileOptions)) ?? {};
}

export async function readPhotoExif(input: Uint8Array | PhotoSource, now = new Date()): Promise<PhotoReading> {
  let tags: Record<string, unknown>;
  try {
    tags = await readTags(asSource(input));
  } catch {
    tags = {};
  }
  const { position, problem } = readPosition(tags);
  const time = readTime(tags, position, now);
  const altitude = asNumber(tags.GPSAltitude);
  const altitudeBelowSea = firstNumber(tags.GPSAltitudeRef) === 1;
  const direction = asNumber(tags.GPSImgDirection);
  const orientation = firstNumber(tags.Orientation);
  const kept: Record<string, unknown> = {};
  for (const tag of keptTags) if (tags[tag] !== undefined) kept[tag] = plain(tags[tag]);
  return {
    position,
    positionProblem: problem,
    altitudeM: altitude === null ? null : altitudeBelowSea ? -altitude : altitude,
    accuracyM: asNumber(tags.GPSHPositioningError),
    directionDeg: direction !== null && direction >= 0 && direction < 360 ? direction : null,
    ...time,
    orientation: orientation && orientation >= 1 && orientation <= 8 ? orientation : 1,
    kept,
  };
}

/** The sentence a scout reads when a photo carries no usable position. */
export function positionProblemSentence(problem: PositionProblem) {
  switch (problem) {
    case 'missing':
      return 'This photo carries no GPS position (location may be off in the camera settings)';
    case 'null-island':
      return 'This photo’s GPS position is 0, 0 (the phone had no fix when it was taken)';
    case 'out-of-range':
      return 'This photo’s GPS position is outside the valid range of latitude and longitude';
    case 'no-reference':
      return 'This photo’s GPS position lacks its north/south or east/west reference';
  }
}
