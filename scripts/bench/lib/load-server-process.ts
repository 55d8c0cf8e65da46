// Starts load-server.ts as a child process on loopback and talks to it over IPC: its port, memory samples taken
// after a forced GC, and a clean stop. Always stop() it (from a finally); a child that will not stop is killed.
import { fork, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';

export type LoadServerRequest = { type: 'memory'; id: number } | { type: 'cpu'; id: number } | { type: 'stop' };

/** process.cpuUsage() of the server: microseconds of CPU since it started, in user and kernel mode. */
export interface ServerCpu {
  user: number;
  system: number;
}

export interface ServerMemory {
  /** process.memoryUsage() figures in bytes, taken right after global.gc(). `external` includes `arrayBuffers`. */
  heapUsed: number;
  heapTotal: number;
  external: number;
  arrayBuffers: number;
  rss: number;
}

export type LoadServerReply = { type: 'listening'; port: number } | ({ type: 'memory'; id: number } & ServerMemory) | ({ type: 'cpu'; id: number } & ServerCpu);

export interface LoadServer {
  baseUrl: string;
  pid: number;
  memory(): Promise<ServerMemory>;
  cpu(): Promise<ServerCpu>;
  stop(): Promise<void>;
}

const serverModule = fileURLToPath(new URL('./load-server.ts', import.meta.url));

const exited = (child: ChildProcess) =>
  new Promise<void>((resolve) => (child.exitCode !== null || child.signalCode !== null ? resolve() : child.once('exit', () => resolve())));

function within<T>(ms: number, what: string, promise: Promise<T>): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => (timer = setTimeout(() => reject(new Error(`${what} did not answer within ${ms / 1000} s`)), ms)));
  return Promise.race([promise, timeout]).finally(() => clearTimeout(timer));
}

/** The environment must already name the throwaway database (DATABASE_URL) and the upload folder. */
export async function startLoadServer(env: NodeJS.ProcessEnv): Promise<LoadServer> {
  const child = fork(serverModule, [], {
    execArgv: ['--import', 'tsx', '--expose-gc', ...(process.env.PROF_DIR ? ['--cpu-prof', '--cpu-prof-dir=' + process.env.PROF_DIR] : [])],
    env: { ...env, WORKERS: 'off' },
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  const pending = new Map<number, (memory: ServerMemory) => void>();
  const pendingCpu = new Map<number, (cpu: ServerCpu) => void>();
  let nextId = 0;
  const port = new Promise<number>((resolve, reject) => {
    child.once('exit', (code, signal) => reject(new Error(`the load server exited before listening (${signal ?? `code ${code}`})`)));
    child.on('message', (reply: LoadServerReply) => {
      if (reply.type === 'listening') resolve(reply.port);
      else if (reply.type === 'memory') {
        pending.get(reply.id)?.(reply);
        pending.delete(reply.id);
      } else if (reply.type === 'cpu') {
        pendingCpu.get(reply.id)?.(reply);
        pendingCpu.delete(reply.id);
      }
    });
  });
  const stop = async () => {
    if (child.connected) child.send({ type: 'stop' } satisfies LoadServerRequest);
    await within(40_000, 'the load server stop', exited(child)).catch(() => {
      child.kill('SIGKILL');
      return exited(child);
    });
  };
  try {
    const listening = await within(60_000, 'the load server start', port);
    return {
      baseUrl: `http://127.0.0.1:${listening}`,
      pid: child.pid!,
      memory: () => {
        const id = nextId++;
        const sample = new Promise<ServerMemory>((resolve) => pending.set(id, resolve));
        child.send({ type: 'memory', id } satisfies LoadServerRequest);
        return within(30_000, 'a memory sample', sample);
      },
      cpu: () => {
        const id = nextId++;
        const sample = new Promise<ServerCpu>((resolve) => pendingCpu.set(id, resolve));
        child.send({ type: 'cpu', id } satisfies LoadServerRequest);
        return within(30_000, 'a CPU sample', sample);
      },
      stop,
    };
  } catch (error) {
    await stop();
    throw error;
  }
}
