// STORAGE_URL: which store it names, and a sentence that says what to fix for a value it cannot use.
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseStorageUrl } from '../../server/services/storage/storage-url.ts';

describe('STORAGE_URL', () => {
  it('keeps the upload folder when unset or blank', () => {
    expect(parseStorageUrl(undefined, 'uploads')).toEqual({ driver: 'file', root: path.resolve('uploads') });
    expect(parseStorageUrl('  ', '/srv/photos')).toEqual({ driver: 'file', root: '/srv/photos' });
  });

  it('reads a file URL as an absolute folder, percent-escapes decoded (RFC 8089)', () => {
    expect(parseStorageUrl('file:///srv/field%20photos', 'uploads')).toEqual({ driver: 'file', root: '/srv/field photos' });
  });

  it('reads a bucket, an optional key prefix, the endpoint, region and path style', () => {
    expect(parseStorageUrl('s3://scouting-photos/prod/eu?endpoint=http://127.0.0.1:9000&region=eu-west-1&forcePathStyle=true', 'uploads')).toEqual({
      driver: 's3',
      bucket: 'scouting-photos',
      prefix: 'prod/eu/',
      endpoint: 'http://127.0.0.1:9000',
      region: 'eu-west-1',
      forcePathStyle: true,
    });
  });

  it('takes the region from AWS_REGION when the URL has none', () => {
    const before = process.env.AWS_REGION;
    process.env.AWS_REGION = 'ca-central-1';
    try {
      expect(parseStorageUrl('s3://scouting-photos', 'uploads')).toMatchObject({ region: 'ca-central-1', endpoint: null, forcePathStyle: false, prefix: '' });
    } finally {
      if (before === undefined) delete process.env.AWS_REGION;
      else process.env.AWS_REGION = before;
    }
  });

  it.each([
    ['not a url', /is not a URL/],
    ['ftp://photos.example/x', /scheme “ftp”; use file: or s3:/],
    ['s3://Bad_Bucket?region=eu-west-1', /bucket name of 3–63 lower-case letters/],
    ['s3://ab?region=eu-west-1', /bucket name of 3–63/],
    ['s3://key:secret@photos-bucket?region=eu-west-1', /must not carry credentials; set AWS_ACCESS_KEY_ID/],
    ['s3://photos-bucket?region=eu-west-1&pathStyle=1', /unknown option “pathStyle”/],
    ['s3://photos-bucket?region=eu-west-1&endpoint=localhost:9000', /endpoint that is not an http:\/\/ or https:\/\/ URL/],
    ['s3://photos-bucket?region=eu-west-1&forcePathStyle=yes', /forcePathStyle other than true or false/],
    ['file:///srv/photos?mode=fast', /takes no options/],
  ])('refuses %s with a sentence saying what to fix', (value, message) => {
    expect(() => parseStorageUrl(value, 'uploads')).toThrow(message);
  });

  it('refuses a bucket without any region', () => {
    const saved = { r: process.env.AWS_REGION, d: process.env.AWS_DEFAULT_REGION };
    delete process.env.AWS_REGION;
    delete process.env.AWS_DEFAULT_REGION;
    try {
      expect(() => parseStorageUrl('s3://photos-bucket', 'uploads')).toThrow(/needs a region/);
    } finally {
      if (saved.r !== undefined) process.env.AWS_REGION = saved.r;
      if (saved.d !== undefined) process.env.AWS_DEFAULT_REGION = saved.d;
    }
  });
});
