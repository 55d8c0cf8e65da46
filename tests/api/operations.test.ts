// Running Patchwise behind a balancer: health and readiness probes, a request id on every answer and log line,
// logs that never carry a notice-link token, and a shutdown that finishes the requests already in flight.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { Writable } from 'node:stream';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app.ts';
import { createLogger } from '../../server/logger.ts';
import { stopQueue } from '../../server/jobs/queue.ts';

afterAll(async () => {
  await stopQueue();
});

function capturedLogger() {
  const lines: Array<Record<string, unknown>> = [];
  const sink = new Writable({
    write(chunk, _encoding, done) {
      for (const line of String(chunk).split('\n').filter(Boolean)) lines.push(JSON.parse(line));
      done();
    },
  });
  return { logger: createLogger(sink, 'info'), lines };
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

describe('probes', () => {
  it('says the process is up on /healthz without touching a session', async () => {
    const res = await request(createApp()).get('/healthz').expect(200);
    expect(res.body).toEqual({ status: 'up' });
    expect(res.headers['set-cookie']).toBeUndefined();
  });

  it('says it is ready on /readyz when the database answers and the photo folder takes writes', async () => {
    const res = await request(createApp()).get('/readyz').expect(200);
    expect(res.body).toEqual({ ready: true, checks: { database: 'ok', storage: 'ok', shutdown: 'ok' } });
  });
});

describe('request ids and logs', () => {
  it('answers with a fresh id, keeps a well-formed one from the caller and replaces a malformed one', async () => {
    const app = createApp();
    expect((await request(app).get('/api/config')).headers['x-request-id']).toMatch(UUID);
    expect((await request(app).get('/api/config').set('X-Request-Id', 'balancer-1234abcd')).headers['x-request-id']).toBe('balancer-1234abcd');
    expect((await request(app).get('/api/config').set('X-Request-Id', 'two words; and more')).headers['x-request-id']).toMatch(UUID);
  });

  it('writes one JSON line per request with its id and status, and keeps notice tokens out of it', async () => {
    const { logger, lines } = capturedLogger();
    const app = createApp({ logger });
    const secret = 'r3cipient.s3cret-never-logged';
    const res = await request(app).get(`/api/notice-links/${secret}?x=1`);
    const line = lines.find((l) => (l.req as { id?: string } | undefined)?.id === res.headers['x-request-id']);
    expect(line).toBeDefined();
    expect(line!.req).toEqual({ id: res.headers['x-request-id'], method: 'GET', path: '/api/notice-links/[token]' });
    expect(line!.res).toEqual({ status: res.status });
    expect(JSON.stringify(lines)).not.toContain('s3cret');
  });
});

describe('graceful shutdown', () => {
  it('finishes a request already in flight, refuses new connections, and then stops', async () => {
    process.env.WORKERS = 'off';
    const { startServer } = await import('../../server/index.ts');
    const running = await startServer({ port: 0 });
    const { port } = running.server.address() as AddressInfo;
    const body = JSON.stringify({ email: 'nobody@patchwise.example', password: 'not-the-password-at-all' });

    // A client that has sent its headers and half its body when the shutdown starts.
    const answered = new Promise<number>((resolve, reject) => {
      const req = http.request(
        {
          host: '127.0.0.1',
          port,
          method: 'POST',
          path: '/api/auth/sign-in',
          headers: { 'content-type': 'application/json', 'content-length': Buffer.byteLength(body) },
        },
        (res) => {
          res.resume();
          resolve(res.statusCode ?? 0);
        },
      );
      req.on('error', reject);
      req.write(body.slice(0, 10));
      setTimeout(() => req.end(body.slice(10)), 300);
    });
    await new Promise((r) => setTimeout(r, 100));
    const stopped = running.close();
    const refused = await new Promise<string>((resolve) => {
      const late = http.get({ host: '127.0.0.1', port, path: '/healthz' }, () => resolve('answered'));
      late.on('error', (error: NodeJS.ErrnoException) => resolve(error.code ?? 'error'));
    });
    expect(refused).toBe('ECONNREFUSED');
    // Any answer is a finished request (the CSRF check refuses this one); a cut-off socket would reject instead.
    expect(await answered).toBeGreaterThanOrEqual(200);
    await stopped;
  });
});
