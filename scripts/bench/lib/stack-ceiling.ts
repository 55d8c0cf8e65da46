// What the server's own stack allows, beside the floor: the app's framework answering GET /api/config's recorded
// bytes with nothing else (Express alone), and with only the session and signed-in user read every /api request
// makes (express-session with the app's store, then passport.session()). Each runs in a child process of its own,
// like the floor and the app, so the rows differ only in what the server does per request.
import type { RecordedAnswer } from './floor-server.ts';

export type CeilingMode = 'express' | 'express-session';

async function serve(mode: CeilingMode, answer: RecordedAnswer) {
  const { default: express } = await import('express');
  const app = express();
  app.disable('x-powered-by');
  if (mode === 'express-session') {
    const { sessionMiddleware } = await import('../../../server/auth/session.ts');
    const { passport } = await import('../../../server/auth/passport.ts');
    const { queryPool } = await import('../../../server/queries/pool.ts');
    app.use(sessionMiddleware(queryPool));
    app.use(passport.session());
  }
  app.get('/api/config', (req, res) => {
    if (mode === 'express-session' && !req.user) return void res.status(401).end();
    res.status(answer.status).set(answer.headers).send(answer.body);
  });
  return new Promise<string>((resolve) => {
    const server = app.listen(0, '127.0.0.1', () => {
      const address = server.address();
      resolve(`http://127.0.0.1:${typeof address === 'object' && address ? address.port : 0}`);
    });
  });
}

if (process.argv[2] === '--ceiling-child' && process.send) {
  const { readFileSync } = await import('node:fs');
  const recorded = JSON.parse(readFileSync(process.argv[4], 'utf8')) as { status: number; headers: Record<string, string>; body: string };
  const baseUrl = await serve(process.argv[3] as CeilingMode, { ...recorded, body: Buffer.from(recorded.body, 'base64') });
  process.send({ type: 'listening', baseUrl });
  process.on('disconnect', () => process.exit(0));
}

/** Starts one ceiling server in a child process (with this process's environment: the bench's database and secret). */
export async function startCeilingProcess(mode: CeilingMode, answer: RecordedAnswer) {
  const { fileURLToPath } = await import('node:url');
  const { startBenchChild } = await import('./bench-child.ts');
  const payload = { ...answer, body: answer.body.toString('base64') };
  return startBenchChild(`${mode} ceiling`, fileURLToPath(import.meta.url), ['--ceiling-child', mode], payload, { ...process.env, LOG_LEVEL: 'silent' });
}
