// Configuration from environment variables, with safe defaults for local use only.
import os from 'node:os';
import path from 'node:path';
import { replicaUrlsFrom } from './db-replication.ts';
import { parseStorageUrl } from './services/storage/storage-url.ts';

export const DEFAULT_SESSION_SECRET = 'patchwise-local-development-secret';

const LOOPBACK_HOSTS = new Set(['127.0.0.1', 'localhost', '[::1]']);

/**
 * The development mailbox is a stand-in for a real mail service: served only while mail goes to the catcher that
 * `npm start` or `npm test` runs (they announce its port in MAIL_CATCHER_PORT), never with a real SMTP server
 * and never in production.
 */
export function mailboxServed(env: NodeJS.ProcessEnv = process.env) {
  if (env.NODE_ENV === 'production' || env.MAIL_CATCHER === 'off' || !env.MAIL_CATCHER_PORT || !env.SMTP_URL) return false;
  try {
    const smtp = new URL(env.SMTP_URL);
    return LOOPBACK_HOSTS.has(smtp.hostname) && smtp.port === env.MAIL_CATCHER_PORT;
  } catch {
    return false;
  }
}

/** Express's `trust proxy`: off unless TRUST_PROXY names the proxies (a hop count, or addresses and subnets). */
export function trustProxySetting(value: string | undefined): boolean | number | string {
  const setting = value?.trim() ?? '';
  if (setting === '' || /^(false|off|no|0)$/i.test(setting)) return false;
  if (/^(true|on|yes)$/i.test(setting)) return true;
  if (/^\d+$/.test(setting)) return Number(setting);
  return setting;
}

function readConfig(env: NodeJS.ProcessEnv = process.env) {
  const isProduction = env.NODE_ENV === 'production';
  const port = Number(env.PORT ?? 3000);
  const config = {
    isProduction,
    isTest: env.NODE_ENV === 'test' || env.VITEST === 'true',
    port,
    databaseUrl: env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/patchwise',
    // Read replicas (comma-separated URLs): plain reads outside transactions go there, everything else to DATABASE_URL.
    databaseReplicaUrls: replicaUrlsFrom(env.DATABASE_REPLICA_URLS),
    // After a write, the same browser reads from the primary this long: longer than replicas usually trail behind.
    replicaCatchUpSeconds: Number(env.REPLICA_CATCH_UP_SECONDS ?? 5),
    smtpUrl: env.SMTP_URL ?? 'smtp://127.0.0.1:2525',
    mailFrom: env.MAIL_FROM ?? 'Patchwise <notices@patchwise.local>',
    publicUrl: (env.PUBLIC_URL ?? `http://127.0.0.1:${port}`).replace(/\/$/, ''),
    tileUrl: env.TILE_URL ?? 'https://tile.openstreetmap.org/{z}/{x}/{y}.png',
    sessionSecret: env.SESSION_SECRET ?? DEFAULT_SESSION_SECRET,
    uploadDir: path.resolve(env.UPLOAD_DIR ?? 'uploads'),
    // Where photos live: the upload folder unless STORAGE_URL names another folder or a bucket.
    storage: parseStorageUrl(env.STORAGE_URL, path.resolve(env.UPLOAD_DIR ?? 'uploads')),
    // Uploads are written here while they arrive (one temp file per photo, removed when its request is done), so
    // no request holds a whole photo in memory; a folder on disk, not a RAM-backed tmpfs, keeps that true.
    photoSpoolDir: path.resolve(env.PHOTO_SPOOL_DIR ?? path.join(os.tmpdir(), 'patchwise-photo-spool')),
    clientDir: path.resolve(env.CLIENT_DIR ?? 'dist'),
    signInLimitPerWindow: Number(env.SIGN_IN_LIMIT ?? 10),
    // Failed sign-ins per client address over every e-mail address, per 15 minutes (against guessing across accounts).
    signInAddressLimitPerWindow: Number(env.SIGN_IN_ADDRESS_LIMIT ?? 100),
    trustProxy: trustProxySetting(env.TRUST_PROXY),
    mailboxServed: mailboxServed(env),
  };
  return config;
}

export type Config = ReturnType<typeof readConfig>;

export const config: Config = readConfig();

/** Refuses to run a production server with the published default secret. */
export function assertSafeForProduction(c: Config = config) {
  if (c.isProduction && c.sessionSecret === DEFAULT_SESSION_SECRET) {
    throw new Error('SESSION_SECRET must be set to a long random value when NODE_ENV=production.');
  }
}
