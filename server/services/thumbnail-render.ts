// Renders a photo's thumbnail: the embedded EXIF thumbnail when it is big enough (fast path), otherwise
// a full decode (mozjpeg through @jsquash/jpeg for JPEG, libwebp through @jsquash/webp for WebP, heic-decode for
// HEIC, jimp for PNG); then scaled (box prescale, then jimp) and turned upright for its EXIF orientation. Pure CPU work: runs in a worker thread.
import fs from 'node:fs';
import { createRequire } from 'node:module';
import exifr from 'exifr';
import { Jimp, ResizeStrategy } from 'jimp';
import decodeJpeg, { init as initJpegDecoder } from '@jsquash/jpeg/decode.js';
import decodeWebp, { init as initWebpDecoder } from '@jsquash/webp/decode.js';
import heicDecode from 'heic-decode';
import { boxScaleDown, type RgbaBitmap } from './thumbnail-box-scale.ts';

/** Long edge of a thumbnail in pixels. */
export const THUMBNAIL_EDGE = 320;
/** An embedded EXIF thumbnail serves when its long edge reaches this (phones write 160–512 px). */
export const EMBEDDED_MIN_EDGE = 160;

type JimpImage = InstanceType<typeof Jimp>;

export interface RenderedThumbnail {
  bytes: Buffer;
  width: number;
  height: number;
  source: 'embedded' | 'decoded';
}

/**
 * Readies one of the @jsquash codecs once per thread. The emscripten glue cannot fetch its .wasm in Node, so it is
 * compiled from the package's own file; the decoders return an ImageData, which Node lacks, so a plain holder of
 * the same shape stands in.
 */
function wasmDecoder(wasmFile: string, init: (module: WebAssembly.Module) => Promise<unknown> | void) {
  let ready: Promise<void> | null = null;
  return () =>
    (ready ??= (async () => {
      const module = await WebAssembly.compile(fs.readFileSync(createRequire(import.meta.url).resolve(wasmFile)));
      (globalThis as { ImageData?: unknown }).ImageData ??= class ImageData {
        constructor(
          public data: Uint8ClampedArray,
          public width: number,
          public height: number,
        ) {}
      };
      await init(module);
    })());
}

const ensureJpegDecoder = wasmDecoder('@jsquash/jpeg/codec/dec/mozjpeg_dec.wasm', initJpegDecoder);
const ensureWebpDecoder = wasmDecoder('@jsquash/webp/codec/dec/webp_dec.wasm', (module) => initWebpDecoder(module));

const arrayBufferOf = (bytes: Uint8Array) => bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;

const fromRgba = (data: Uint8ClampedArray | Uint8Array, width: number, height: number) =>
  Jimp.fromBitmap({ data: Buffer.from(data.buffer, data.byteOffset, data.byteLength), width, height }) as JimpImage;

/** Turns the image upright for EXIF Orientation 1–8 (TIFF 6.0 tag 274), in place. Jimp's rotate(-90) turns clockwise. */
export function applyOrientation(image: JimpImage, orientation: number) {
  const mirror = () => void image.flip({ horizontal: true, vertical: false });
  if (orientation === 2) mirror();
  else if (orientation === 3) image.rotate(180);
  else if (orientation === 4) image.flip({ horizontal: false, vertical: true });
  else if (orientation === 5) {
    image.rotate(-90);
    mirror();
  } else if (orientation === 6) image.rotate(-90);
  else if (orientation === 7) {
    image.rotate(90);
    mirror();
  } else if (orientation === 8) image.rotate(90);
}

/** The thumbnail's size for a picture of this size: THUMBNAIL_EDGE on the long side, never enlarged. */
function thumbnailSize(width: number, height: number) {
  const scale = THUMBNAIL_EDGE / Math.max(width, height);
  if (scale >= 1) return { width, height };
  return { width: Math.max(1, Math.round(width * scale)), height: Math.max(1, Math.round(height * scale)) };
}

/** Cuts the bitmap to the thumbnail's size: a box prescale to about twice the size, then jimp's bilinear resize. */
function scaleDown(bitmap: RgbaBitmap): JimpImage {
  const target = thumbnailSize(bitmap.width, bitmap.height);
  const prescaled = boxScaleDown(bitmap, Math.max(bitmap.width, bitmap.height) / (2 * THUMBNAIL_EDGE));
  const image = fromRgba(prescaled.data, prescaled.width, prescaled.height);
  if (prescaled.width !== target.width || prescaled.height !== target.height)
    image.resize({ w: target.width, h: target.height, mode: ResizeStrategy.BILINEAR });
  return image;
}

const decodeMozjpeg = async (bytes: Uint8Array): Promise<RgbaBitmap> => {
  await ensureJpegDecoder();
  return decodeJpeg(arrayBufferOf(bytes));
};

const decodeLibwebp = async (bytes: Uint8Array): Promise<RgbaBitmap> => {
  await ensureWebpDecoder();
  return decodeWebp(arrayBufferOf(bytes));
};

/** The embedded EXIF thumbnail, when there is one big enough; exifr reads only the file's head for it. */
async function embeddedThumbnail(source: string | Buffer): Promise<RgbaBitmap | null> {
  const embedded = await exifr.thumbnail(source).catch(() => undefined);
  if (!embedded || embedded.length < 100) return null;
  const bitmap = await decodeMozjpeg(embedded).catch(() => null);
  if (!bitmap || Math.max(bitmap.width, bitmap.height) < EMBEDDED_MIN_EDGE) return null;
  return bitmap;
}

async function decodeFull(bytes: Buffer, mimeType: string): Promise<RgbaBitmap> {
  if (mimeType === 'image/jpeg') return decodeMozjpeg(bytes);
  if (mimeType === 'image/webp') return decodeLibwebp(bytes);
  if (mimeType === 'image/heic' || mimeType === 'image/heif') return heicDecode({ buffer: bytes });
  return ((await Jimp.read(bytes)) as JimpImage).bitmap;
}

/** What to render: the stored file's path (the thread reads it, so the bytes never cross threads) or the bytes. */
export type ThumbnailSource = { path: string; mimeType: string; orientation: number } | { bytes: Uint8Array; mimeType: string; orientation: number };

export async function renderThumbnail(input: ThumbnailSource): Promise<RenderedThumbnail> {
  let bytes = 'bytes' in input ? Buffer.from(input.bytes.buffer, input.bytes.byteOffset, input.bytes.byteLength) : null;
  const embedded = input.mimeType === 'image/jpeg' ? await embeddedThumbnail(bytes ?? (input as { path: string }).path) : null;
  bytes ??= embedded ? null : await fs.promises.readFile((input as { path: string }).path);
  const image = scaleDown(embedded ?? (await decodeFull(bytes!, input.mimeType)));
  // Turned upright after scaling, on 320 px rather than 12 MP.
  // libheif already applies the HEIF container's rotation; EXIF orientation there would turn it twice.
  if (input.mimeType !== 'image/heic' && input.mimeType !== 'image/heif') applyOrientation(image, input.orientation);
  const out = await image.getBuffer('image/jpeg', { quality: 78 });
  return { bytes: out, width: image.bitmap.width, height: image.bitmap.height, source: embedded ? 'embedded' : 'decoded' };
}
