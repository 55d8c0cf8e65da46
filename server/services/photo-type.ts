// What a file really is, decided from its bytes (file-type), and whether it arrived whole.
import { fileTypeFromBuffer } from 'file-type';
import { imageSize } from 'image-size';
import { photoLimits } from './photo-limits.ts';

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
function jpegIsComplete(bytes: Uint8Array) {
  let offset = 2;
  // Walk the marker segments to the start of scan, then look for the end-of-image marker after it.
  while (offset + 4 <= bytes.length) {
    if (bytes[offset] !== 0xff) return false;
    const marker = bytes[offset + 1];
    if (marker === 0xff) {
      offset += 1;
      continue;
    }
    const length = (bytes[offset + 2] << 8) | bytes[offset + 3];
    if (marker === 0xda) return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).indexOf(Buffer.from([0xff, 0xd9]), offset + 2 + length) !== -1;
    offset += 2 + length;
  }
  return false;
}

function pngIsComplete(bytes: Uint8Array) {
  return Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).indexOf(Buffer.from('IEND', 'ascii'), 8) !== -1;
}

function webpIsComplete(bytes: Uint8Array) {
  // RIFF size field: file length minus the 8-byte RIFF header.
  const declared = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).readUInt32LE(4);
  return bytes.length >= declared + 8;
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

export async function sniffPhotoType(bytes: Uint8Array, maxMegapixels = photoLimits().maxMegapixels): Promise<PhotoTypeVerdict> {
  if (bytes.length === 0) return { ok: false, message: 'This file is empty (0 bytes); take or choose the photo again.' };
  const detected = await fileTypeFromBuffer(bytes);
  const mime = detected?.mime as string | undefined;
  if (!mime || !(acceptedPhotoTypes as readonly string[]).includes(mime)) {
    const what = mime ? `a ${mime} file` : 'not a recognisable image';
    return { ok: false, message: `This file is ${what}, whatever its name says; send a JPEG, PNG, WebP or HEIC photo.` };
  }
  const mimeType = mime as PhotoMimeType;
  const complete =
    mimeType === 'image/jpeg'
      ? jpegIsComplete(bytes)
      : mimeType === 'image/png'
        ? pngIsComplete(bytes)
        : mimeType === 'image/webp'
          ? webpIsComplete(bytes)
          : true;
  if (!complete) return { ok: false, message: 'This photo file is incomplete (it was cut off before the end); send it again.' };
  const tooLarge = pixelLimitProblem(bytes, maxMegapixels);
  if (tooLarge) return { ok: false, message: tooLarge };
  return { ok: true, mimeType };
}
