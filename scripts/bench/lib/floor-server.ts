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
  const { fileURLToPath } = await import('node:url');
  const { startBenchChild } = await import('./bench-child.ts');
  const payload = [...answers].map(([p, a]) => [p, { ...a, body: a.body.toString('base64') }]);
  return startBenchChild('floor', fileURLToPath(import.meta.url), ['--child'], payload);
}
