// Thumbnails of WebP photos: a picture encoded by libwebp's own encoder (@jsquash/webp) comes out at the thumbnail
// size with its halves' colours where they were. Lossy WebP moves colours a little, so the check is on which
// channel dominates, not on exact values.
import fs from 'node:fs';
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { Jimp } from 'jimp';
import encodeWebp, { init as initWebpEncoder } from '@jsquash/webp/encode.js';
import { renderThumbnail, THUMBNAIL_EDGE } from '../../server/services/thumbnail-render.ts';

/** A width × height picture, red on the left half and blue on the right, as libwebp encodes it. */
async function twoToneWebp(width: number, height: number) {
  const wasm = createRequire(import.meta.url).resolve('@jsquash/webp/codec/enc/webp_enc_simd.wasm');
  await initWebpEncoder(await WebAssembly.compile(fs.readFileSync(wasm)));
  const data = new Uint8ClampedArray(width * height * 4);
  for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) data.set(x < width / 2 ? [200, 30, 30, 255] : [30, 30, 200, 255], (y * width + x) * 4);
  return new Uint8Array(await encodeWebp({ data, width, height, colorSpace: 'srgb' } as ImageData, { quality: 90 }));
}

describe('thumbnail of a WebP photo', () => {
  it('decodes it, scales the long edge to the thumbnail size and keeps the picture', async () => {
    const webp = await twoToneWebp(800, 600);
    expect(Buffer.from(webp.subarray(0, 4)).toString('latin1')).toBe('RIFF');
    expect(Buffer.from(webp.subarray(8, 12)).toString('latin1')).toBe('WEBP');

    const rendered = await renderThumbnail({ bytes: webp, mimeType: 'image/webp', orientation: 1 });
    expect(rendered).toMatchObject({ width: THUMBNAIL_EDGE, height: (THUMBNAIL_EDGE * 600) / 800, source: 'decoded' });
    const thumbnail = await Jimp.read(rendered.bytes);
    expect([thumbnail.bitmap.width, thumbnail.bitmap.height]).toEqual([rendered.width, rendered.height]);
    const at = (x: number, y: number) =>
      Array.from(thumbnail.bitmap.data.subarray((y * thumbnail.bitmap.width + x) * 4, (y * thumbnail.bitmap.width + x) * 4 + 3));
    const [leftR, , leftB] = at(40, 120);
    const [rightR, , rightB] = at(280, 120);
    expect(leftR).toBeGreaterThan(leftB + 100);
    expect(rightB).toBeGreaterThan(rightR + 100);
  });
});
