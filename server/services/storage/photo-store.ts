// What every photo store does: whole objects under keys made by storage.ts, written only once complete.
import type { Readable } from 'node:stream';

export interface ListedObject {
  /** Storage key, or null for an entry that is not one of ours (a temp file, a stray). */
  key: string | null;
  /** Where it lives: a path in the folder, or s3://bucket/key. */
  path: string;
  modifiedAt: Date;
}

export interface PhotoStore {
  /** Stores the bytes, or the file at `file`, under the key; a reader never sees half an object. */
  put(key: string, source: Uint8Array | { file: string; size: number }): Promise<void>;
  read(key: string): Promise<Buffer>;
  /** Bytes [start, end) of the object. */
  readRange(key: string, start: number, end: number): Promise<Buffer>;
  /** A stream of the object and its size, or null when it is missing. */
  open(key: string): Promise<{ stream: Readable; size: number } | null>;
  remove(key: string): Promise<void>;
  removeListed(entry: ListedObject): Promise<void>;
  list(): Promise<ListedObject[]>;
  /** Throws when the store cannot be written (the readiness probe's sentence comes from the caller). */
  check(): Promise<void>;
  /** The file's path when the store is a local folder (the thumbnail thread reads it there itself). */
  localPath(key: string): string | null;
  readonly description: string;
}
