// `npm start`: local PostgreSQL with PostGIS, migrations, demo seed, mail catcher, client build, one server.
// With WORKERS=only it runs the background workers on the local stack instead, and serves no web pages.
import { spawnSync } from 'node:child_process';
import { projectRoot } from './lib/local-env.ts';
import { startLocalStack } from './lib/local-stack.ts';
import { workerMode } from '../server/jobs/worker-mode.ts';

process.chdir(projectRoot);
const stack = await startLocalStack();

async function serveTheApp() {
  console.log('Building the client…');
  const build = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn'], { stdio: 'inherit' });
  if (build.status !== 0) {
    await stack.stop();
    process.exit(build.status ?? 1);
  }

  const { demoAccounts } = await import('./seed/seed-demo.ts');
  const { startServer } = await import('../server/index.ts');
  const { config } = await import('../server/config.ts');
  const running = await startServer({ port: config.port });

  console.log(`
Patchwise is running at ${config.publicUrl}
${stack.seeded ? 'Demo scenario seeded.' : 'Demo scenario already present.'}${stack.catcher ? ` Mail catcher on smtp://127.0.0.1:${stack.catcher.port} (read it at ${config.publicUrl}/admin/mailbox).` : ''}

Demo accounts (password for all: ${demoAccounts()[0].password}):
${demoAccounts()
  .map((a) => `  ${a.role.padEnd(8)} ${a.email}`)
  .join('\n')}

Press Ctrl-C to stop.`);
  return running;
}

async function runTheWorkers() {
  const { startWorkerProcess } = await import('../server/worker.ts');
  const running = await startWorkerProcess();
  console.log(`Patchwise workers are running (${running.workers.join(', ')}); WORKERS=only serves no web pages. Press Ctrl-C to stop.`);
  return running;
}

const running = workerMode() === 'only' ? await runTheWorkers() : await serveTheApp();

let stopping = false;
async function stop() {
  if (stopping) return;
  stopping = true;
  console.log('\nStopping Patchwise…');
  await running.close().catch(() => {});
  await stack.stop();
  process.exit(0);
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
