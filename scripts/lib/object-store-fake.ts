// A local S3-compatible fake (s3rver) on loopback, standing in for object storage the way the mail catcher
// stands in for SMTP. It keeps objects in a folder of its own and accepts the credentials S3RVER / S3RVER.
import S3rver from 's3rver';

export const FAKE_BUCKET = 'patchwise-test';
export const FAKE_CREDENTIALS = { AWS_ACCESS_KEY_ID: 'S3RVER', AWS_SECRET_ACCESS_KEY: 'S3RVER' };

export async function startObjectStoreFake(options: { port: number; directory: string }) {
  const server = new S3rver({
    address: '127.0.0.1',
    port: options.port,
    directory: options.directory,
    silent: true,
    configureBuckets: [{ name: FAKE_BUCKET }],
  });
  await server.run();
  return {
    /** STORAGE_URL for the fake's bucket. */
    storageUrl: `s3://${FAKE_BUCKET}?endpoint=http://127.0.0.1:${options.port}&region=us-east-1&forcePathStyle=true`,
    close: () => server.close(),
  };
}
