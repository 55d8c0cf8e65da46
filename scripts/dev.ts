// `npm run dev`: the local stack, the API restarted on every server change (tsx watch), and Vite's dev
// server with hot reload, which forwards /api to the API (vite.config.ts). Ctrl-C stops all of it.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { localDefaults, projectRoot } from './lib/local-env.ts';
import { startLocalStack } from './lib/local-stack.ts';

process.chdir(projectRoot);
const stack = await startLocalStack();
const { demoAccounts } = await import('./seed/seed-demo.ts');

const apiEnv = {
  ...process.env,
  // The API serves no stale build in development: Vite serves the client.
  CLIENT_DIR: path.join(projectRoot, '.data', 'no-client-in-dev'),
  PUBLIC_URL: process.env.PUBLIC_URL ?? 'http://127.0.0.1:5173',
};
const children: ChildProcess[] = [
  spawn('npx', ['tsx', 'watch', '--clear-screen=false', 'server/index.ts'], { env: apiEnv, stdio: 'inherit' }),
  spawn('npx', ['vite', '--host', '127.0.0.1', '--port', '5173', '--strictPort'], { env: process.env, stdio: 'inherit' }),
];

console.log(`
Patchwise (development): client with hot reload at http://127.0.0.1:5173, API on port ${process.env.PORT ?? localDefaults.appPort}
Demo accounts (password for all: ${demoAccounts()[0].password}): ${demoAccounts()
  .map((a) => a.email)
  .join(', ')}
Press Ctrl-C to stop.`);

let stopping = false;
async function stop() {
  if (stopping) return;
  stopping = true;
  for (const child of children) child.kill('SIGTERM');
  await stack.stop();
  process.exit(0);
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
for (const child of children)
  child.on('exit', (code) => {
    if (!stopping) {
      console.error(`A development process stopped (exit ${code}); stopping the rest.`);
      void stop();
    }
  });
