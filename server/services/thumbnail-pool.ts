// Thumbnails are rendered in worker threads (piscina), so decoding a 12 MP photo never stalls the API's event loop
// and both cores work. THUMBNAIL_THREADS=0 renders on the calling thread instead.
import { availableParallelism } from 'node:os';
import { Piscina } from 'piscina';
import { BACKGROUND_THREAD_NICE } from './background-priority.ts';
import type { RenderedThumbnail, ThumbnailSource } from './thumbnail-render.ts';

let pool: Piscina | null = null;

export const thumbnailThreads = () => {
  const configured = Number(process.env.THUMBNAIL_THREADS);
  return Number.isFinite(configured) && configured >= 0 ? Math.floor(configured) : Math.max(1, availableParallelism());
};

export async function renderInPool(input: ThumbnailSource): Promise<RenderedThumbnail> {
  const threads = thumbnailThreads();
  if (threads === 0) {
    const { renderThumbnail } = await import('./thumbnail-render.ts');
    return renderThumbnail(input);
  }
  pool ??= new Piscina({
    filename: new URL('./thumbnail-render-bootstrap.mjs', import.meta.url).href,
    minThreads: 0,
    maxThreads: threads,
    idleTimeout: 10_000,
    // piscina applies it through @napi-rs/nice, in each render thread only.
    niceIncrement: BACKGROUND_THREAD_NICE,
  });
  const result = (await pool.run(input)) as RenderedThumbnail;
  // Buffers come back from the thread as plain Uint8Arrays.
  return { ...result, bytes: Buffer.from(result.bytes) };
}

export async function closeThumbnailPool() {
  const closing = pool;
  pool = null;
  await closing?.destroy();
}
