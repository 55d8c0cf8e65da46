// `npm start`: local PostgreSQL with PostGIS, migrations, demo seed, mail catcher, client build, one server.
import { spawnSync } from 'node:child_process';
import { projectRoot } from './lib/local-env.ts';
import { startLocalStack } from './lib/local-stack.ts';

process.chdir(projectRoot);
const stack = await startLocalStack();

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
