// Photo storage that is down until a test brings it up: an S3 endpoint on a loopback port nothing listens on, where the
// local S3 fake starts later. Set `storageUrl` as STORAGE_URL before the server reads its configuration (vi.hoisted).
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { freePort } from '../../scripts/lib/free-port.ts';
import { FAKE_BUCKET, FAKE_CREDENTIALS, startObjectStoreFake } from '../../scripts/lib/object-store-fake.ts';

export async function objectStoreOutage() {
  const port = await freePort();
  const directory = fs.mkdtempSync(path.join(os.tmpdir(), 'patchwise-outage-store-'));
  let running: Awaited<ReturnType<typeof startObjectStoreFake>> | undefined;
  return {
    storageUrl: `s3://${FAKE_BUCKET}?endpoint=http://127.0.0.1:${port}&region=us-east-1&forcePathStyle=true`,
    credentials: FAKE_CREDENTIALS,
    /** The storage answers from now on. */
    async restore() {
      running ??= await startObjectStoreFake({ port, directory });
    },
    async close() {
      await running?.close();
      fs.rmSync(directory, { recursive: true, force: true });
    },
  };
}
