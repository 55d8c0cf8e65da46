// What a file really is, decided from its bytes (file-type), and whether it arrived whole.
import { fileTypeFromBuffer } from 'file-type';
import { acceptedPhotoTypes, type PhotoMimeType } from '../models/photo.ts';

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

export async function sniffPhotoType(bytes: Uint8Array): Promise<PhotoTypeVerdict> {
  if (bytes.length === 0) return { ok: false, message: 'This file is empty (0 bytes); take or choose the photo again.' };
  const detected = await fileTypeFromBuffer(bytes);
  const mime = detected?.mime as string | undefined;
  if (!mime || !(acceptedPhotoTypes as readonly string[]).includes(mime)) {
    const what = mime ? `a ${mime} file` : 'not a recognisable image';
    return { ok: false, message: `This file is ${what}, whatever its name says; send a JPEG, PNG, WebP or HEIC photo.` };
  }
  const mimeType = mime as PhotoMimeType;
  const complete = mimeType === 'image/jpeg' ? jpegIsComplete(bytes) : mimeType === 'image/png' ? pngIsComplete(bytes) : mimeType === 'image/webp' ? webpIsComplete(bytes) : true;
  if (!complete) return { ok: false, message: 'This photo file is incomplete (it was cut off before the end); send it again.' };
  return { ok: true, mimeType };
}
