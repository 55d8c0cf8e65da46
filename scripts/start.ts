// `npm start`: local PostgreSQL with PostGIS, migrations, demo seed, mail catcher, client build, one server.
import { spawnSync } from 'node:child_process';
import { clusterFor, databaseUrl, ensureDatabase, initCluster, startCluster, stopCluster } from './lib/postgres.ts';
import { localDefaults, projectRoot } from './lib/local-env.ts';

process.chdir(projectRoot);
const cluster = clusterFor(localDefaults.dataDir, localDefaults.databasePort);
const usesLocalCluster = !process.env.DATABASE_URL;
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

console.log('Building the client…');
const build = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn'], { stdio: 'inherit' });
if (build.status !== 0) process.exit(build.status ?? 1);

// Server modules read their configuration on import, so they load only after the environment is set.
const { runMigrations } = await import('../server/migrate.ts');
const { seedDemo, demoAccounts } = await import('./seed/seed-demo.ts');
const { startMailCatcher } = await import('../server/mail/catcher.ts');
const { startServer } = await import('../server/index.ts');
const { config } = await import('../server/config.ts');

await runMigrations();
const seeded = await seedDemo();
const catcher = usesMailCatcher ? await startMailCatcher({ port: localDefaults.smtpPort, databaseUrl: process.env.DATABASE_URL! }) : null;
const running = await startServer({ port: config.port });

console.log(`
Patchwise is running at ${config.publicUrl}
${seeded.created ? 'Demo scenario seeded.' : 'Demo scenario already present.'}${catcher ? ` Mail catcher on smtp://127.0.0.1:${catcher.port} (read it at ${config.publicUrl}/admin/mailbox).` : ''}

Demo accounts (password for all: ${demoAccounts()[0].password}):
${demoAccounts().map((a) => `  ${a.role.padEnd(8)} ${a.email}`).join('\n')}

Press Ctrl-C to stop.`);

let stopping = false;
async function stop() {
  if (stopping) return;
  stopping = true;
  console.log('\nStopping Patchwise…');
  await running.close().catch(() => {});
  await catcher?.close().catch(() => {});
  if (startedCluster) stopCluster(cluster);
  process.exit(0);
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
