// `npm test`: starts only what the chosen suites need (a throwaway PostgreSQL cluster and mail catcher for
// api/e2e/faults, the client build for e2e, the audit line for a full run), then runs them. The cluster is
// stopped and its folder removed whatever the outcome; the last line is "N passed, N failed".
import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { clusterFor, databaseUrl, ensureDatabase, initCluster, reachableDataDir, startCluster, stopCluster, type Cluster } from './lib/postgres.ts';
import { freePort } from './lib/free-port.ts';
import { projectRoot } from './lib/local-env.ts';
import { testNeeds } from './lib/test-selection.ts';
import { FAKE_CREDENTIALS, startObjectStoreFake } from './lib/object-store-fake.ts';

process.chdir(projectRoot);
const vitestArgs = process.argv.slice(2);
const needs = testNeeds(vitestArgs);
const workDir = fs.mkdtempSync(path.join(os.tmpdir(), 'patchwise-test-'));
fs.chmodSync(workDir, 0o755);
let cluster = null as Cluster | null;
let catcher = null as { close(): Promise<void> } | null;
let objectStore = null as { close(): Promise<void> } | null;

function cleanUp() {
  try {
    if (cluster) stopCluster(cluster);
  } finally {
    if (cluster && !cluster.dataDir.startsWith(workDir)) fs.rmSync(path.dirname(cluster.dataDir), { recursive: true, force: true });
    fs.rmSync(workDir, { recursive: true, force: true });
  }
}

function summaryFrom(file: string) {
  if (!fs.existsSync(file)) return null;
  const report = JSON.parse(fs.readFileSync(file, 'utf8')) as {
    numPassedTests: number;
    numFailedTests: number;
    numTotalTestSuites: number;
    testResults: Array<{ status: string; message?: string; name: string }>;
  };
  // A file that fails to load counts as a failure even though none of its tests ran.
  const brokenFiles = report.testResults.filter((r) => r.status === 'failed' && r.message && !r.message.includes('Test failed')).length;
  return { passed: report.numPassedTests, failed: report.numFailedTests, brokenFiles };
}

/** Cluster, migrations and mail catcher for the suites that talk to the database. */
async function startDatabaseAndMail(env: NodeJS.ProcessEnv) {
  cluster = clusterFor(reachableDataDir(path.join(workDir, 'postgres')), await freePort(), { durable: false });
  initCluster(cluster);
  startCluster(cluster);
  await ensureDatabase(cluster, 'patchwise_test');
  const smtpPort = await freePort();
  Object.assign(env, {
    DATABASE_URL: databaseUrl(cluster, 'patchwise_test'),
    SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
    SMTP_PORT: String(smtpPort),
    // The harness runs the catcher, so the development mailbox is served (see mailboxServed in server/config.ts).
    MAIL_CATCHER_PORT: String(smtpPort),
  });
  Object.assign(process.env, env);
  const migrate = spawnSync('node', ['--import', 'tsx', 'scripts/migrate.ts'], { env, stdio: 'inherit' });
  if (migrate.status !== 0) throw new Error('Migrations failed.');
  const { startMailCatcher } = await import('../server/mail/catcher.ts');
  catcher = await startMailCatcher({ port: smtpPort, databaseUrl: env.DATABASE_URL! });
  // The S3 driver's suites store photos in a local fake; the others keep the upload folder (STORAGE_URL unset).
  const fake = await startObjectStoreFake({ port: await freePort(), directory: path.join(workDir, 'object-store') });
  objectStore = fake;
  Object.assign(env, { TEST_S3_STORAGE_URL: fake.storageUrl, ...FAKE_CREDENTIALS });
  Object.assign(process.env, env);
}

let exitCode: number;
try {
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: 'test',
    UPLOAD_DIR: path.join(workDir, 'uploads'),
    // Servers the fault suites kill mid-upload leave spool files; here they go with the run's folder.
    PHOTO_SPOOL_DIR: path.join(workDir, 'spool'),
    // Each run builds its own client, so two runs at once never serve each other's half-written build.
    CLIENT_DIR: path.join(workDir, 'dist'),
    SESSION_SECRET: 'patchwise-test-secret-not-for-production',
    PATCHWISE_TEST_TMP: workDir,
    // Nothing listens on port 9: maps in the browser tests show how they behave with no tile server.
    TILE_URL: 'http://127.0.0.1:9/{z}/{x}/{y}.png',
  };
  Object.assign(process.env, env);
  console.log(`Suites: ${needs.projects.join(', ')}`);

  if (needs.database) await startDatabaseAndMail(env);

  if (needs.clientBuild) {
    console.log('Building the client…');
    const build = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn', '--outDir', env.CLIENT_DIR!, '--emptyOutDir'], {
      env: { ...env, NODE_ENV: 'production' },
      stdio: 'inherit',
    });
    if (build.status !== 0) throw new Error('The client build failed.');
  }

  if (needs.audit) {
    // Printed for the record; `npm run audit` is the check that fails on a high or critical advisory.
    const audit = spawnSync('node', ['--import', 'tsx', 'scripts/audit.ts'], { env, encoding: 'utf8', timeout: 150_000 });
    console.log((audit.stdout ?? '').trim() || 'Dependency audit not checked: `npm audit` did not finish.');
  }

  const reportFile = path.join(workDir, 'vitest-report.json');
  const projectArgs = vitestArgs.some((a) => a === '--project' || a.startsWith('--project=')) ? [] : needs.projects.flatMap((p) => ['--project', p]);
  const vitest = spawn('npx', ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${reportFile}`, ...projectArgs, ...vitestArgs], {
    env,
    stdio: 'inherit',
  });
  const vitestCode: number = await new Promise((resolve) => vitest.on('exit', (code) => resolve(code ?? 1)));
  const summary = summaryFrom(reportFile);
  const failed = (summary?.failed ?? 0) + (summary?.brokenFiles ?? 0) + (summary ? 0 : 1);
  exitCode = vitestCode === 0 && failed === 0 ? 0 : 1;
  await catcher?.close();
  catcher = null;
  await objectStore?.close();
  objectStore = null;
  cleanUp();
  console.log(`${summary?.passed ?? 0} passed, ${Math.max(failed, exitCode)} failed`);
} catch (error) {
  console.error((error as Error).message);
  await catcher?.close().catch(() => {});
  await objectStore?.close().catch(() => {});
  cleanUp();
  console.log('0 passed, 1 failed');
  exitCode = 1;
}
process.exit(exitCode);
