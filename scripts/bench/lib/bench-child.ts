// A bench server in a child process of its own (run through tsx), so it does not share an event loop with the load
// generator. Its payload goes through a temp file, not the environment: one environment string holds at most 128 KB
// and a check's answer is larger. The child reads the file named by its last argument and reports
// `{ type: 'listening', baseUrl }` over IPC; it exits when the parent disconnects.
import { fork } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

export async function startBenchChild(label: string, moduleFile: string, args: string[], payload: unknown, env: NodeJS.ProcessEnv = process.env) {
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), `patchwise-${label}-`)), 'payload.json');
  fs.writeFileSync(file, JSON.stringify(payload));
  const child = fork(moduleFile, [...args, file], { execArgv: ['--import', 'tsx'], env, stdio: ['ignore', 'inherit', 'inherit', 'ipc'] });
  const baseUrl = await new Promise<string>((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`the ${label} server exited before listening (code ${code})`)));
    child.on('message', (m: { type: string; baseUrl: string }) => m.type === 'listening' && resolve(m.baseUrl));
  });
  return {
    baseUrl,
    stop: async () => {
      const exited = new Promise((resolve) => child.once('exit', resolve));
      child.disconnect();
      await exited;
      fs.rmSync(path.dirname(file), { recursive: true, force: true });
    },
  };
}
