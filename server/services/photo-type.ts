// What a file really is, decided from its bytes (file-type), and whether it arrived whole.
import { fileTypeFromBuffer } from 'file-type';
import { imageSize } from 'image-size';
import { photoLimits } from './photo-limits.ts';
import { asSource, occursAfter, windowed, type PhotoSource } from './photo-source.ts';
import { heifHeaderBoxes } from './heif-exif.ts';

export const acceptedPhotoTypes = ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif'] as const;
export type PhotoMimeType = (typeof acceptedPhotoTypes)[number];

export const extensionFor: Record<PhotoMimeType, string> = {
  'image/jpeg': 'jpg',
  'image/png': 'png',
  'image/webp': 'webp',
  'image/heic': 'heic',
  'image/heif': 'heif',
};

export type PhotoTypeVerdict = { ok: true; mimeType: PhotoMimeType } | { ok: false; message: string };

// A full decode would tell too, but it blocks the event loop ~0.5 s for a 12 MP photo; these byte checks
// (hand-written: no maintained package checks completeness without decoding) catch files cut off in transit.
// They read the file's head and range reads, never the whole file at once.

/** JPEG start-of-frame markers whose segment gives the size (ITU-T T.81 B.2.2), as image-size reads them. */
const sizedFrames = new Set([0xc0, 0xc1, 0xc2]);

interface JpegWalk {
  complete: boolean;
  /** Enough leading bytes for image-size to find the frame size: the head, or SOI + the frame segment found beyond it. */
  sizeBytes: Uint8Array;
}

async function walkJpeg(source: PhotoSource): Promise<JpegWalk> {
  const read = windowed(source);
  let offset = 2;
  let frame: Uint8Array | null = null;
  // Walk the marker segments to the start of scan, then look for the end-of-image marker after it.
  while (offset + 4 <= source.size) {
    const header = await read(offset, offset + 4);
    if (header[0] !== 0xff) break;
    const marker = header[1];
    if (marker === 0xff) {
      offset += 1;
      continue;
    }
    const length = (header[2] << 8) | header[3];
    if (!frame && sizedFrames.has(marker) && offset + 2 + length > source.head.length) frame = await read(offset, offset + 2 + length);
    if (marker === 0xda) {
      const complete = await occursAfter(source, endOfImage, offset + 2 + length);
      // A comment segment of length 2 stands in for the segments before the frame, so image-size reaches it.
      const sizeBytes = frame ? Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xfe, 0x00, 0x02]), frame]) : source.head;
      return { complete, sizeBytes };
    }
    offset += 2 + length;
  }
  return { complete: false, sizeBytes: source.head };
}

const endOfImage = Uint8Array.from([0xff, 0xd9]);
const pngEnd = new TextEncoder().encode('IEND');

function webpIsComplete(source: PhotoSource) {
  // RIFF size field: file length minus the 8-byte RIFF header.
  const declared = Buffer.from(source.head.buffer, source.head.byteOffset, source.head.byteLength).readUInt32LE(4);
  return source.size >= declared + 8;
}

const grouped = new Intl.NumberFormat('en');

/** Width × height from the file's headers (image-size), without decoding; null when the headers do not say. */
export function declaredPixels(bytes: Uint8Array): { width: number; height: number } | null {
  try {
    const size = imageSize(bytes);
    const all = [size, ...(size.images ?? [])].filter((s) => s.width && s.height);
    return all.reduce<{ width: number; height: number } | null>(
      (largest, s) => (!largest || s.width * s.height > largest.width * largest.height ? { width: s.width, height: s.height } : largest),
      null,
    );
  } catch {
    return null;
  }
}

/** The sentence for a photo whose decoded size would pass the pixel limit, decided before any decoding. */
export function pixelLimitProblem(bytes: Uint8Array, maxMegapixels: number): string | null {
  const size = declaredPixels(bytes);
  if (!size || size.width * size.height <= maxMegapixels * 1_000_000) return null;
  const exact = (size.width * size.height) / 1_000_000;
  const megapixels = exact < 10 ? Math.round(exact * 10) / 10 : Math.round(exact);
  return `This photo is ${grouped.format(size.width)} × ${grouped.format(size.height)} pixels (${megapixels} MP); Patchwise takes photos of at most ${maxMegapixels} MP. Send a smaller copy (phones can share a reduced size).`;
}

export async function sniffPhotoType(input: Uint8Array | PhotoSource, maxMegapixels = photoLimits().maxMegapixels): Promise<PhotoTypeVerdict> {
  const source = asSource(input);
  if (source.size === 0) return { ok: false, message: 'This file is empty (0 bytes); take or choose the photo again.' };
  const detected = await fileTypeFromBuffer(source.head);
  const mime = detected?.mime as string | undefined;
  if (!mime || !(acceptedPhotoTypes as readonly string[]).includes(mime)) {
    const what = mime ? `a ${mime} file` : 'not a recognisable image';
    return { ok: false, message: `This file is ${what}, whatever its name says; send a JPEG, PNG, WebP or HEIC photo.` };
  }
  const mimeType = mime as PhotoMimeType;
  let complete = true;
  let sizeBytes = source.head;
  if (mimeType === 'image/jpeg') ({ complete, sizeBytes } = await walkJpeg(source));
  else if (mimeType === 'image/png') complete = await occursAfter(source, pngEnd, 8);
  else if (mimeType === 'image/webp') complete = webpIsComplete(source);
  else sizeBytes = (await heifHeaderBoxes(source))?.bytes ?? source.head;
  if (!complete) return { ok: false, message: 'This photo file is incomplete (it was cut off before the end); send it again.' };
  const tooLarge = pixelLimitProblem(sizeBytes, maxMegapixels);
  if (tooLarge) return { ok: false, message: tooLarge };
  return { ok: true, mimeType };
}
