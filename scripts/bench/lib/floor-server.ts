// The floor for the read routes: a bare node:http server that answers each path with the very bytes (status, type,
// encoding, body) the app gave for it once, with no session, database or middleware. What the app's figures are
// set beside: the most a Node process on this machine can answer with those bytes.
import http from 'node:http';
import type { AddressInfo } from 'node:net';

export interface RecordedAnswer {
  status: number;
  headers: Record<string, string>;
  body: Buffer;
}

const KEPT_HEADERS = ['content-type', 'content-encoding', 'vary', 'cache-control'];

/** The raw bytes of one answer, not decompressed, so the floor sends what went over the wire. */
export function recordAnswer(baseUrl: string, path: string, headers: Record<string, string>): Promise<RecordedAnswer> {
  return new Promise((resolve, reject) => {
    http
      .get(`${baseUrl}${path}`, { headers }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => {
          const kept: Record<string, string> = {};
          for (const name of KEPT_HEADERS) if (typeof res.headers[name] === 'string') kept[name] = res.headers[name];
          resolve({ status: res.statusCode ?? 0, headers: kept, body: Buffer.concat(chunks) });
        });
        res.on('error', reject);
      })
      .on('error', reject);
  });
}

export async function startFloorServer(answers: Map<string, RecordedAnswer>) {
  const server = http.createServer((req, res) => {
    const answer = answers.get(req.url ?? '');
    if (!answer) {
      res.writeHead(404).end();
      return;
    }
    res.writeHead(answer.status, { ...answer.headers, 'content-length': answer.body.length });
    res.end(answer.body);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return {
    baseUrl: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    stop: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}

// In a child process of its own, like the app server, so the floor does not share its event loop with autocannon.
if (process.argv[2] === '--child' && process.send) {
  const { readFileSync } = await import('node:fs');
  const recorded = JSON.parse(readFileSync(process.argv[3], 'utf8')) as Array<[string, { status: number; headers: Record<string, string>; body: string }]>;
  const floor = await startFloorServer(new Map(recorded.map(([path, a]) => [path, { ...a, body: Buffer.from(a.body, 'base64') }])));
  process.send({ type: 'listening', baseUrl: floor.baseUrl });
  process.on('disconnect', () => process.exit(0));
}

/** Starts the floor in a child process; stop() ends it. */
export async function startFloorProcess(answers: Map<string, RecordedAnswer>) {
  const { fork } = await import('node:child_process');
  const { fileURLToPath } = await import('node:url');
  const fs = await import('node:fs');
  const os = await import('node:os');
  const path = await import('node:path');
  // A file, not the environment: one environment string holds at most 128 KB and a check's answer is larger.
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'patchwise-floor-')), 'answers.json');
  fs.writeFileSync(file, JSON.stringify([...answers].map(([p, a]) => [p, { ...a, body: a.body.toString('base64') }])));
  const child = fork(fileURLToPath(import.meta.url), ['--child', file], {
    execArgv: ['--import', 'tsx'],
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  const baseUrl = await new Promise<string>((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`the floor server exited before listening (code ${code})`)));
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
