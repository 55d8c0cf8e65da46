// Configuration from environment variables, with safe defaults for local use only.
import path from 'node:path';

export const DEFAULT_SESSION_SECRET = 'patchwise-local-development-secret';

function readConfig(env: NodeJS.ProcessEnv = process.env) {
  const isProduction = env.NODE_ENV === 'production';
  const port = Number(env.PORT ?? 3000);
  const config = {
    isProduction,
    isTest: env.NODE_ENV === 'test' || env.VITEST === 'true',
    port,
    databaseUrl: env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/patchwise',
    smtpUrl: env.SMTP_URL ?? 'smtp://127.0.0.1:2525',
    mailFrom: env.MAIL_FROM ?? 'Patchwise <notices@patchwise.local>',
    publicUrl: (env.PUBLIC_URL ?? `http://127.0.0.1:${port}`).replace(/\/$/, ''),
    tileUrl: env.TILE_URL ?? 'https://tile.openstreetmap.org/{z}/{x}/{y}.png',
    sessionSecret: env.SESSION_SECRET ?? DEFAULT_SESSION_SECRET,
    uploadDir: path.resolve(env.UPLOAD_DIR ?? 'uploads'),
    clientDir: path.resolve(env.CLIENT_DIR ?? 'dist'),
    signInLimitPerWindow: Number(env.SIGN_IN_LIMIT ?? 10),
    mailCatcherEnabled: env.MAIL_CATCHER !== 'off',
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
