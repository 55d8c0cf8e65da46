// Serialised answers of finished pattern checks. A done check never changes, so its megabytes of JSON are
// stringified and gzipped once and then served as bytes, instead of parsed, rebuilt and compressed per request.
import crypto from 'node:crypto';
import { promisify } from 'node:util';
import zlib from 'node:zlib';

export interface SerialisedAnswer {
  /** Weak: the plain and gzipped bodies carry the same content. */
  etag: string;
  json: Buffer;
  /** Present only for cached (finished) answers; otherwise the compression middleware decides. */
  gzip: Buffer | null;
}

const gzip = promisify(zlib.gzip);
/** Bounds the cache by bytes (plain + gzip); a 5,000-sighting result is about 1.7 MB plain and a tenth of that gzipped. */
const MAX_BYTES = 64 * 1024 * 1024;

const weakEtag = (json: Buffer) => `W/"${crypto.createHash('sha1').update(json).digest('base64url')}"`;

export function serialise(json: string): SerialisedAnswer {
  const bytes = Buffer.from(json, 'utf8');
  return { etag: weakEtag(bytes), json: bytes, gzip: null };
}

// A Map keeps insertion order, which is all an LRU needs; hand-written because no LRU package is a direct dependency.
const entries = new Map<string, { version: string; answer: SerialisedAnswer; size: number }>();
const building = new Map<string, Promise<SerialisedAnswer>>();
let cachedBytes = 0;

function remember(id: string, version: string, answer: SerialisedAnswer) {
  forget(id);
  const size = answer.json.length + (answer.gzip?.length ?? 0);
  if (size > MAX_BYTES) return;
  entries.set(id, { version, answer, size });
  cachedBytes += size;
  for (const [oldest, entry] of entries) {
    if (cachedBytes <= MAX_BYTES) break;
    entries.delete(oldest);
    cachedBytes -= entry.size;
  }
}

function forget(id: string) {
  const entry = entries.get(id);
  if (!entry) return;
  entries.delete(id);
  cachedBytes -= entry.size;
}

/**
 * The answer for check `id` at `version` (anything that changes when the stored answer could: its update time,
 * finish time and the runner's name). Concurrent misses for one version share one build.
 */
export async function cachedAnswer(id: string, version: string, build: () => Promise<string>): Promise<SerialisedAnswer> {
  const entry = entries.get(id);
  if (entry?.version === version) {
    entries.delete(id);
    entries.set(id, entry);
    return entry.answer;
  }
  const key = `${id}|${version}`;
  const pending = building.get(key);
  if (pending) return pending;
  const promise = (async () => {
    const answer = serialise(await build());
    answer.gzip = await gzip(answer.json);
    remember(id, version, answer);
    return answer;
  })().finally(() => building.delete(key));
  building.set(key, promise);
  return promise;
}
