// The local set-up both `npm start` and `npm test` share: cluster folder, ports and database name.
import path from 'node:path';

export const projectRoot = path.resolve(path.dirname(new URL(import.meta.url).pathname), '../..');

export const localDefaults = {
  dataDir: path.join(projectRoot, '.data', 'postgres'),
  databasePort: Number(process.env.PATCHWISE_DB_PORT ?? 54329),
  database: 'patchwise',
  appPort: Number(process.env.PORT ?? 3000),
  smtpPort: Number(process.env.PATCHWISE_SMTP_PORT ?? 2525),
};
