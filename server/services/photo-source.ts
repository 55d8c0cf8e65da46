// One uploaded photo as the checks read it: its size, its first bytes in memory and range reads for the rest,
// whether the bytes sit in memory (the seed, tests) or in a spooled temp file (uploads), so no check needs it whole.
import fsp from 'node:fs/promises';

/** Bytes kept in memory from the start of each file: the type sniff, JPEG APP1 (≤ 64 KB) and most HEIF meta boxes fit. */
export const HEAD_BYTES = 256 * 1024;

export interface PhotoSource {
  size: number;
  /** The first min(size, HEAD_BYTES) bytes. */
  head: Uint8Array;
  /** Bytes [start, end) of the file, clipped to its end. */
  read(start: number, end: number): Promise<Uint8Array>;
  /** The spooled file, when the bytes are on disk (exifr reads it in chunks itself). */
  file: string | null;
  /** What storage writes: the bytes, or the finished temp file. */
  body: Uint8Array | { file: string; size: number };
}

export function bytesSource(bytes: Uint8Array): PhotoSource {
  return {
    size: bytes.length,
    head: bytes.subarray(0, HEAD_BYTES),
    read: async (start, end) => bytes.subarray(Math.max(0, start), Math.min(bytes.length, end)),
    file: null,
    body: bytes,
  };
}

export function fileSource(file: string, size: number, head: Uint8Array): PhotoSource {
  return {
    size,
    head,
    async read(start, end) {
      const from = Math.max(0, start);
      const to = Math.min(size, end);
      if (to <= from) return new Uint8Array(0);
      if (to <= head.length) return head.subarray(from, to);
      const handle = await fsp.open(file, 'r');
      try {
        const buffer = Buffer.alloc(to - from);
        const { bytesRead } = await handle.read(buffer, 0, buffer.length, from);
        return buffer.subarray(0, bytesRead);
      } finally {
        await handle.close();
      }
    },
    file,
    body: { file, size },
  };
}

export const asSource = (input: Uint8Array | PhotoSource): PhotoSource => (input instanceof Uint8Array ? bytesSource(input) : input);

const SCAN_CHUNK = 64 * 1024;

/**
 * Small reads served from one 64 KB window of the file at a time: walking thousands of tiny segments costs one
 * file read per window, not one per segment.
 */
export function windowed(source: PhotoSource): (start: number, end: number) => Promise<Uint8Array> {
  let windowStart = 0;
  let window = source.head;
  return async (start, end) => {
    const wanted = Math.min(end, source.size);
    if (start >= windowStart && wanted <= windowStart + window.length) return window.subarray(start - windowStart, wanted - windowStart);
    if (end - start > SCAN_CHUNK) return source.read(start, end);
    windowStart = start;
    window = await source.read(start, start + SCAN_CHUNK);
    return window.subarray(0, Math.max(0, wanted - start));
  };
}

/**
 * Whether `needle` occurs anywhere at or after `from`, read in bounded chunks from the end backwards: a whole file
 * ends with its end marker, so the first chunk read usually answers.
 */
export async function occursAfter(source: PhotoSource, needle: Uint8Array, from: number) {
  let end = source.size;
  while (end - from >= needle.length) {
    const start = Math.max(from, end - SCAN_CHUNK);
    const chunk = Buffer.from(await source.read(start, end));
    if (chunk.indexOf(needle) !== -1) return true;
    if (start === from) return false;
    // Overlap so a needle split across two chunks is still found.
    end = start + needle.length - 1;
  }
  return false;
}
