// Photos as objects in an S3-compatible bucket (@aws-sdk/client-s3). Credentials come from the SDK's usual chain
// (AWS_ACCESS_KEY_ID / AWS_SECRET_ACCESS_KEY, profiles, instance roles). Objects stay private: the app streams them.
import fs from 'node:fs';
import type { Readable } from 'node:stream';
import { DeleteObjectCommand, GetObjectCommand, HeadBucketCommand, ListObjectsV2Command, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import type { ListedObject, PhotoStore } from './photo-store.ts';

export interface S3Location {
  bucket: string;
  prefix: string;
  endpoint: string | null;
  region: string;
  forcePathStyle: boolean;
}

const isMissing = (error: unknown) => {
  const e = error as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e.name === 'NoSuchKey' || e.name === 'NotFound' || e.$metadata?.httpStatusCode === 404;
};

export function s3Store(location: S3Location, isKey: (key: string) => boolean): PhotoStore {
  const client = new S3Client({
    region: location.region,
    ...(location.endpoint ? { endpoint: location.endpoint } : {}),
    forcePathStyle: location.forcePathStyle,
    // A photo streamed from its spool file would otherwise go up aws-chunked with a CRC trailer, which not every
    // S3-compatible store decodes (the local fake stored the framing as the object); S3 itself needs no checksum here.
    requestChecksumCalculation: 'WHEN_REQUIRED',
  });
  const Bucket = location.bucket;
  const objectKey = (key: string) => {
    if (!isKey(key)) throw new Error(`not a storage key: ${key}`);
    return `${location.prefix}${key}`;
  };
  const get = async (key: string, range?: string) => {
    const answer = await client.send(new GetObjectCommand({ Bucket, Key: objectKey(key), ...(range ? { Range: range } : {}) }));
    return answer;
  };
  return {
    description: `s3://${Bucket}/${location.prefix}`,
    localPath: () => null,
    async put(key, source) {
      // A PUT becomes visible only when the whole body has arrived, so no reader sees half a photo.
      const Body = source instanceof Uint8Array ? source : fs.createReadStream(source.file);
      const ContentLength = source instanceof Uint8Array ? source.byteLength : source.size;
      await client.send(new PutObjectCommand({ Bucket, Key: objectKey(key), Body, ContentLength }));
    },
    async read(key) {
      const answer = await get(key);
      return Buffer.from(await answer.Body!.transformToByteArray());
    },
    async readRange(key, start, end) {
      if (end <= start) return Buffer.alloc(0);
      const answer = await get(key, `bytes=${start}-${end - 1}`);
      return Buffer.from(await answer.Body!.transformToByteArray());
    },
    async open(key) {
      try {
        const answer = await get(key);
        return { stream: answer.Body as Readable, size: Number(answer.ContentLength ?? 0) };
      } catch (error) {
        if (isMissing(error)) return null;
        throw error;
      }
    },
    async remove(key) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: objectKey(key) }));
    },
    async removeListed(entry) {
      const Key = entry.path.slice(`s3://${Bucket}/`.length);
      await client.send(new DeleteObjectCommand({ Bucket, Key }));
    },
    async list() {
      const found: ListedObject[] = [];
      let ContinuationToken: string | undefined;
      do {
        const page = await client.send(new ListObjectsV2Command({ Bucket, Prefix: location.prefix, ContinuationToken }));
        for (const object of page.Contents ?? []) {
          if (!object.Key) continue;
          const key = object.Key.slice(location.prefix.length);
          found.push({ key: isKey(key) ? key : null, path: `s3://${Bucket}/${object.Key}`, modifiedAt: object.LastModified ?? new Date() });
        }
        ContinuationToken = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (ContinuationToken);
      return found;
    },
    async check() {
      await client.send(new HeadBucketCommand({ Bucket }));
    },
  };
}
