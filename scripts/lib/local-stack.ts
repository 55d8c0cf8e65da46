// The local stack `npm start` and `npm run dev` share: the project's cluster (unless DATABASE_URL is set),
// migrations, the demo seed and the mail catcher (unless SMTP_URL is set). Environment first, imports after.
import { clusterFor, databaseUrl, ensureDatabase, initCluster, reachableDataDir, startCluster, stopCluster } from './postgres.ts';
import { localDefaults } from './local-env.ts';

export async function startLocalStack() {
  const usesLocalCluster = !process.env.DATABASE_URL;
  const cluster = clusterFor(usesLocalCluster ? reachableDataDir(localDefaults.dataDir) : localDefaults.dataDir, localDefaults.databasePort);
  let startedCluster = false;
  if (usesLocalCluster) {
    if (initCluster(cluster)) console.log(`Created a PostgreSQL cluster in ${cluster.dataDir}`);
    startedCluster = startCluster(cluster);
    await ensureDatabase(cluster, localDefaults.database);
    process.env.DATABASE_URL = databaseUrl(cluster, localDefaults.database);
  }
  const usesMailCatcher = !process.env.SMTP_URL;
  process.env.SMTP_URL ??= `smtp://127.0.0.1:${localDefaults.smtpPort}`;
  // Tells the server its mail goes to our own catcher, so the development mailbox may be served.
  if (usesMailCatcher) process.env.MAIL_CATCHER_PORT = String(localDefaults.smtpPort);
  else delete process.env.MAIL_CATCHER_PORT;
  process.env.PORT ??= String(localDefaults.appPort);

  // Server modules read their configuration on import, so they load only after the environment is set.
  const { runMigrations } = await import('../../server/migrate.ts');
  const { seedDemo } = await import('../seed/seed-demo.ts');
  const { startMailCatcher } = await import('../../server/mail/catcher.ts');
  await runMigrations();
  const seeded = await seedDemo();
  const catcher = usesMailCatcher ? await startMailCatcher({ port: localDefaults.smtpPort, databaseUrl: process.env.DATABASE_URL! }) : null;

  return {
    seeded: seeded.created,
    catcher,
    async stop() {
      await catcher?.close().catch(() => {});
      if (startedCluster) stopCluster(cluster);
    },
  };
}
