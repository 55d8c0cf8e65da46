// The photo checks read a spooled file through its head and range reads. Here the head is cut to 16 bytes, so
// every structure they need (JPEG segments and end marker, PNG IEND, HEIF ftyp/meta boxes and the Exif item) lies
// beyond it and has to be found by range reads, and the answers must match what the files are known to hold.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Jimp } from 'jimp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fileSource } from '../../server/services/photo-source.ts';
import { sniffPhotoType } from '../../server/services/photo-type.ts';
import { readPhotoExif } from '../../server/services/exif-reading.ts';

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'patchwise-range-reads-'));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

/** The bytes as a spooled file whose in-memory head is only 16 bytes long. */
function spooled(name: string, bytes: Buffer) {
  const file = path.join(dir, name);
  fs.writeFileSync(file, bytes);
  return fileSource(file, bytes.length, bytes.subarray(0, 16));
}

/** A real JPEG (jimp's encoder) of noise, 1200 × 900 pixels. */
async function noisy(mime: 'image/jpeg' | 'image/png') {
  const image = new Jimp({ width: 1200, height: 900, color: 0x000000ff });
  let state = 99;
  for (let i = 0; i < image.bitmap.data.length; i++) {
    state = (state * 1103515245 + 12345) >>> 0;
    if (i % 4 !== 3) image.bitmap.data[i] = state >>> 24;
  }
  return mime === 'image/jpeg' ? image.getBuffer(mime, { quality: 90 }) : image.getBuffer(mime);
}

let jpeg: Buffer;
let png: Buffer;
beforeAll(async () => {
  jpeg = await noisy('image/jpeg');
  png = await noisy('image/png');
});

const incomplete = 'This photo file is incomplete (it was cut off before the end); send it again.';

describe('photo checks through range reads', () => {
  it('takes a whole JPEG, also with bytes after its end-of-image marker as some phones append', async () => {
    expect(await sniffPhotoType(spooled('whole.jpg', jpeg))).toEqual({ ok: true, mimeType: 'image/jpeg' });
    const trailed = Buffer.concat([jpeg, Buffer.alloc(200 * 1024, 0x20)]);
    expect(await sniffPhotoType(spooled('trailed.jpg', trailed))).toEqual({ ok: true, mimeType: 'image/jpeg' });
  });

  it('finds a JPEG and a PNG cut off in transit incomplete', async () => {
    expect(await sniffPhotoType(spooled('cut.jpg', jpeg.subarray(0, Math.floor(jpeg.length * 0.6))))).toEqual({ ok: false, message: incomplete });
    expect(await sniffPhotoType(spooled('whole.png', png))).toEqual({ ok: true, mimeType: 'image/png' });
    expect(await sniffPhotoType(spooled('cut.png', png.subarray(0, Math.floor(png.length * 0.6))))).toEqual({ ok: false, message: incomplete });
  });

  it('reads the frame size of a JPEG beyond the head for the pixel limit', async () => {
    // 1200 × 900 is the size the JPEG was encoded at (ITU-T T.81 B.2.2 start-of-frame).
    const verdict = await sniffPhotoType(spooled('large.jpg', jpeg), 0.5);
    expect(verdict.ok).toBe(false);
    expect(!verdict.ok && verdict.message).toMatch(/^This photo is 1,200 × 900 pixels \(1\.1 MP\); Patchwise takes photos of at most 0\.5 MP\./);
  });

  // Made by tests/fixtures/photos/make-heic-fixtures.sh: GPS 41.2345 N, 96.5432 W written by exiftool. The 64 × 48
  // picture is a grid over one 64 × 64 coded tile (`exiftool -a -ImageSpatialExtent` lists both ispe boxes), and the
  // pixel limit goes by the largest image the file declares.
  it.each(['exif-in-base-offset.heic', 'exif-in-extent-offset.heic'])('reads the type, size and GPS position of %s from its boxes', async (name) => {
    const bytes = fs.readFileSync(path.join('tests/fixtures/photos', name));
    const source = spooled(name, bytes);
    expect(await sniffPhotoType(source)).toEqual({ ok: true, mimeType: 'image/heic' });
    const limited = await sniffPhotoType(source, 0.001);
    expect(!limited.ok && limited.message).toMatch(/^This photo is 64 × 64 pixels/);
    const reading = await readPhotoExif(source, new Date('2026-07-02T00:00:00Z'));
    expect(reading.position!.lat).toBeCloseTo(41.2345, 6);
    // EXIF 2.32 §4.6.6: W is a negative longitude.
    expect(reading.position!.lon).toBeCloseTo(-96.5432, 6);
    expect(reading.kept.DateTimeOriginal).toBeDefined();
  });
});
