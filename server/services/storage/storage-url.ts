// Reads STORAGE_URL: `file:///absolute/folder` for the local folder, or
// `s3://bucket[/prefix]?endpoint=http://host:port&region=…&forcePathStyle=true` for S3-compatible object storage.
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export type StorageLocation =
  { driver: 'file'; root: string } | { driver: 's3'; bucket: string; prefix: string; endpoint: string | null; region: string; forcePathStyle: boolean };

const fail = (value: string, why: string): never => {
  throw new Error(`STORAGE_URL “${value}” ${why}`);
};

/** The storage STORAGE_URL names, or the upload folder when it is unset; throws a sentence saying what to fix. */
export function parseStorageUrl(value: string | undefined, uploadDir: string): StorageLocation {
  if (!value?.trim()) return { driver: 'file', root: path.resolve(uploadDir) };
  let url: URL;
  try {
    url = new URL(value.trim());
  } catch {
    return fail(value, 'is not a URL; use file:///absolute/folder or s3://bucket?region=….');
  }
  if (url.protocol === 'file:') {
    if (url.search) fail(value, 'takes no options; use file:///absolute/folder.');
    return { driver: 'file', root: path.resolve(fileURLToPath(url)) };
  }
  if (url.protocol !== 's3:') return fail(value, `has the scheme “${url.protocol.replace(':', '')}”; use file: or s3:.`);
  const bucket = url.hostname;
  // S3 bucket naming rules: 3–63 characters, lower-case letters, digits, dots and hyphens.
  if (!/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/.test(bucket)) fail(value, 'needs a bucket name of 3–63 lower-case letters, digits, dots or hyphens after s3://.');
  if (url.username || url.password) fail(value, 'must not carry credentials; set AWS_ACCESS_KEY_ID and AWS_SECRET_ACCESS_KEY instead.');
  const known = new Set(['endpoint', 'region', 'forcePathStyle']);
  for (const key of url.searchParams.keys())
    if (!known.has(key)) fail(value, `has an unknown option “${key}”; the options are endpoint, region and forcePathStyle.`);
  const endpoint = url.searchParams.get('endpoint');
  if (endpoint !== null) {
    let parsed: URL | null;
    try {
      parsed = new URL(endpoint);
    } catch {
      parsed = null;
    }
    if (!parsed || !['http:', 'https:'].includes(parsed.protocol)) fail(value, 'has an endpoint that is not an http:// or https:// URL.');
  }
  const style = url.searchParams.get('forcePathStyle');
  if (style !== null && !['true', 'false'].includes(style)) fail(value, 'has forcePathStyle other than true or false.');
  const region = url.searchParams.get('region') ?? process.env.AWS_REGION ?? process.env.AWS_DEFAULT_REGION;
  if (!region) fail(value, 'needs a region (…?region=eu-west-1, or AWS_REGION).');
  const prefix = url.pathname.replace(/^\/+|\/+$/g, '');
  return { driver: 's3', bucket, prefix: prefix ? `${prefix}/` : '', endpoint, region: region!, forcePathStyle: style === 'true' };
}
