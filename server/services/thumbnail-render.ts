// Renders a photo's thumbnail: the embedded EXIF thumbnail when it is big enough (fast path), otherwise
// a full decode (mozjpeg through @jsquash/jpeg for JPEG, heic-decode for HEIC, jimp for PNG), then EXIF
// orientation applied and the result scaled with jimp. Pure CPU work: runs in a worker thread.
import fs from 'node:fs';
import { createRequire } from 'node:module';
import exifr from 'exifr';
import { Jimp, ResizeStrategy } from 'jimp';
import decodeJpeg, { init as initJpegDecoder } from '@jsquash/jpeg/decode.js';
import heicDecode from 'heic-decode';

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

let jpegReady: Promise<void> | null = null;
function ensureJpegDecoder() {
  jpegReady ??= (async () => {
    // The emscripten glue cannot fetch its .wasm in Node; compile it from the package's file instead.
    const wasmPath = createRequire(import.meta.url).resolve('@jsquash/jpeg/codec/dec/mozjpeg_dec.wasm');
    const module = await WebAssembly.compile(fs.readFileSync(wasmPath));
    // The decoder returns an ImageData, which Node lacks: a plain holder of the same shape is enough.
    (globalThis as { ImageData?: unknown }).ImageData ??= class ImageData {
      constructor(
        public data: Uint8ClampedArray,
        public width: number,
        public height: number,
      ) {}
    };
    await initJpegDecoder(module);
  })();
  return jpegReady;
}

const fromRgba = (data: Uint8ClampedArray | Uint8Array, width: number, height: number) =>
  Jimp.fromBitmap({ data: Buffer.from(data.buffer, data.byteOffset, data.byteLength), width, height }) as JimpImage;

/** Turns the image upright for EXIF Orientation 1–8 (TIFF 6.0 tag 274), in place. Jimp's rotate(-90) turns clockwise. */
export function applyOrientation(image: JimpImage, orientation: number) {
  const mirror = () => void image.flip({ horizontal: true, vertical: false });
  if (orientation === 2) mirror();
  else if (orientation === 3) image.rotate(180);
  else if (orientation === 4) image.flip({ horizontal: false, vertical: true });
  else if (orientation === 5) (image.rotate(-90), mirror());
  else if (orientation === 6) image.rotate(-90);
  else if (orientation === 7) (image.rotate(90), mirror());
  else if (orientation === 8) image.rotate(90);
}

/** Scales the image down (never up) to THUMBNAIL_EDGE on its long side, in place. */
function scaleDown(image: JimpImage) {
  const { width, height } = image.bitmap;
  const scale = THUMBNAIL_EDGE / Math.max(width, height);
  if (scale >= 1) return;
  // A cheap nearest-neighbour pass to twice the size first: bilinear over 12 MP is the slow part otherwise.
  if (scale < 0.25) image.resize({ w: Math.round(width * scale * 2), h: Math.round(height * scale * 2), mode: ResizeStrategy.NEAREST_NEIGHBOR });
  image.resize({ w: Math.max(1, Math.round(width * scale)), h: Math.max(1, Math.round(height * scale)), mode: ResizeStrategy.BILINEAR });
}

async function embeddedThumbnail(bytes: Buffer): Promise<JimpImage | null> {
  const embedded = await exifr.thumbnail(bytes).catch(() => undefined);
  if (!embedded || embedded.length < 100) return null;
  const image = (await Jimp.read(Buffer.from(embedded)).catch(() => null)) as JimpImage | null;
  if (!image || Math.max(image.bitmap.width, image.bitmap.height) < EMBEDDED_MIN_EDGE) return null;
  return image;
}

async function decodeFull(bytes: Buffer, mimeType: string): Promise<JimpImage> {
  if (mimeType === 'image/jpeg') {
    await ensureJpegDecoder();
    const decoded = await decodeJpeg(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
    return fromRgba(decoded.data, decoded.width, decoded.height);
  }
  if (mimeType === 'image/heic' || mimeType === 'image/heif') {
    const decoded = await heicDecode({ buffer: bytes });
    return fromRgba(decoded.data, decoded.width, decoded.height);
  }
  return (await Jimp.read(bytes)) as JimpImage;
}

export async function renderThumbnail(input: { bytes: Uint8Array; mimeType: string; orientation: number }): Promise<RenderedThumbnail> {
  const bytes = Buffer.from(input.bytes.buffer, input.bytes.byteOffset, input.bytes.byteLength);
  const embedded = input.mimeType === 'image/jpeg' ? await embeddedThumbnail(bytes) : null;
  const image = embedded ?? (await decodeFull(bytes, input.mimeType));
  // libheif already applies the HEIF container's rotation; EXIF orientation there would turn it twice.
  if (input.mimeType !== 'image/heic' && input.mimeType !== 'image/heif') applyOrientation(image, input.orientation);
  scaleDown(image);
  const out = await image.getBuffer('image/jpeg', { quality: 78 });
  return { bytes: out, width: image.bitmap.width, height: image.bitmap.height, source: embedded ? 'embedded' : 'decoded' };
}
