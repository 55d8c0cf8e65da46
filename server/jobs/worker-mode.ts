// Which part of the app a process runs, from WORKERS: web and queue workers together (one-process `npm start`),
// web only (many stateless web processes behind a balancer), or workers only (scaled apart from the web).
export type WorkerMode = 'all' | 'none' | 'only';

const NAMES: Record<string, WorkerMode> = { '': 'all', all: 'all', none: 'none', off: 'none', only: 'only' };

/** The mode WORKERS names; `off` is kept as another name for `none`. Anything else is refused with the names to use. */
export function workerMode(value: string | undefined = process.env.WORKERS): WorkerMode {
  const mode = NAMES[(value ?? '').trim().toLowerCase()];
  if (!mode) throw new Error(`WORKERS must be all (web and workers, the default), none (web only) or only (workers only), not "${value}".`);
  return mode;
}
