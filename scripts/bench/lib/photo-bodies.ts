// Upload bodies for the load bench: every request carries a photo with bytes no earlier request had, so the
// server ingests it instead of answering "duplicate" (photos are matched by SHA-256 of their bytes).
import crypto from 'node:crypto';

/**
 * Inserts a JPEG comment segment (COM, marker 0xFFFE; ITU-T T.81 §B.2.4.5) holding `note` right after the
 * APP1 EXIF segment, so the picture and its EXIF are untouched and only the file's hash changes.
 */
export function withComment(jpeg: Buffer, note: string): Buffer {
  if (jpeg[0] !== 0xff || jpeg[1] !== 0xd8) throw new Error('not a JPEG (no SOI marker)');
  let offset = 2;
  // Step over APP segments (0xFFE0–0xFFEF) so EXIF stays the first thing a reader finds.
  while (jpeg[offset] === 0xff && jpeg[offset + 1] >= 0xe0 && jpeg[offset + 1] <= 0xef) offset += 2 + jpeg.readUInt16BE(offset + 2);
  const text = Buffer.from(note, 'latin1');
  const segment = Buffer.alloc(4 + text.length);
  segment.writeUInt16BE(0xfffe, 0);
  segment.writeUInt16BE(2 + text.length, 2);
  text.copy(segment, 4);
  return Buffer.concat([jpeg.subarray(0, offset), segment, jpeg.subarray(offset)]);
}

export interface PhotoForm {
  contentType: string;
  /** A fresh body each call: the next base photo with a unique comment. */
  next(): Buffer;
}

/**
 * multipart/form-data (RFC 7578) bodies for POST /api/photos, one photo each, built synchronously because
 * autocannon's setupRequest hook is synchronous (a FormData serialiser would need a promise per request).
 */
export function photoForm(basePhotos: Buffer[], fields: Record<string, string>): PhotoForm {
  const boundary = `patchwise-load-${crypto.randomBytes(8).toString('hex')}`;
  const part = (name: string, value: string) => `--${boundary}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`;
  const head = Object.entries(fields)
    .map(([name, value]) => part(name, value))
    .join('');
  const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
  const run = crypto.randomBytes(4).toString('hex');
  let sent = 0;
  return {
    contentType: `multipart/form-data; boundary=${boundary}`,
    next() {
      sent += 1;
      const photo = withComment(basePhotos[sent % basePhotos.length], `load ${run} ${sent}`);
      const filePart = `--${boundary}\r\nContent-Disposition: form-data; name="photos"; filename="load-${sent}.jpg"\r\nContent-Type: image/jpeg\r\n\r\n`;
      return Buffer.concat([Buffer.from(head + filePart), photo, tail]);
    },
  };
}
