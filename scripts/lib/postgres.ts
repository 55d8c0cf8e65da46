// Runs a project-local PostgreSQL cluster on loopback. PostgreSQL refuses to run as root,
// so when we are root every server command runs as the `postgres` user.
import { execFileSync, spawnSync } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';

const isRoot = process.getuid?.() === 0;
const SERVER_USER = 'postgres';

export function postgresBinDir(): string {
  const root = '/usr/lib/postgresql';
  const majors = fs.existsSync(root) ? fs.readdirSync(root).filter((v) => /^\d+$/.test(v)) : [];
  const major = majors.sort((a, b) => Number(a) - Number(b)).at(-1);
  if (!major) throw new Error('PostgreSQL is not installed: run `bash scripts/ensure-system.sh`.');
  return path.join(root, major, 'bin');
}

function runServerCommand(binary: string, args: string[], options: { quiet?: boolean } = {}) {
  const exe = path.join(postgresBinDir(), binary);
  const [cmd, cmdArgs] = isRoot ? ['runuser', ['-u', SERVER_USER, '--', exe, ...args]] : [exe, args];
  const result = spawnSync(cmd, cmdArgs, { encoding: 'utf8', stdio: options.quiet ? 'pipe' : ['ignore', 'pipe', 'pipe'] });
  return result;
}

function ownByServerUser(dir: string) {
  if (isRoot) execFileSync('chown', ['-R', `${SERVER_USER}:${SERVER_USER}`, dir]);
}

export interface Cluster {
  dataDir: string;
  port: number;
  socketDir: string;
  /** Throwaway clusters (npm test) trade crash safety for speed; a cluster that keeps data never does. */
  durable: boolean;
}

export function clusterFor(dataDir: string, port: number, options: { durable?: boolean } = {}): Cluster {
  return { dataDir, port, socketDir: path.join(dataDir, 'socket'), durable: options.durable ?? true };
}

// Where clusters go when the server user cannot enter the project's folder (a clone in root's home or a
// mode-700 temporary folder): PostgreSQL's own home, which that user owns on every Debian install.
const REACHABLE_ROOT = '/var/lib/postgresql/patchwise';

function serverUserCanEnter(dir: string): boolean {
  if (!isRoot) return true;
  // access(2) needs search permission on every folder of the path, so one test covers the whole chain.
  return spawnSync('runuser', ['-u', SERVER_USER, '--', 'test', '-x', dir]).status === 0;
}

/**
 * The data folder to use for a wanted one: the wanted folder itself when the server user can reach its
 * parent, else a folder of the server user's own named after the wanted path, so a second start finds it again.
 */
export function reachableDataDir(wanted: string): string {
  const parent = path.dirname(wanted);
  fs.mkdirSync(parent, { recursive: true });
  if (serverUserCanEnter(parent)) return wanted;
  const key = crypto.createHash('sha256').update(path.resolve(wanted)).digest('hex').slice(0, 16);
  const fallback = path.join(REACHABLE_ROOT, `${path.basename(path.dirname(parent)) || 'project'}-${key}`, path.basename(wanted));
  fs.mkdirSync(path.dirname(fallback), { recursive: true });
  execFileSync('chown', [`${SERVER_USER}:${SERVER_USER}`, REACHABLE_ROOT, path.dirname(fallback)]);
  return fallback;
}

export function initCluster(cluster: Cluster) {
  if (fs.existsSync(path.join(cluster.dataDir, 'PG_VERSION'))) return false;
  fs.mkdirSync(cluster.dataDir, { recursive: true });
  ownByServerUser(cluster.dataDir);
  // Loopback-only cluster owned by the project; trust auth is limited to 127.0.0.1 and the private socket.
  const result = runServerCommand('initdb', ['-D', cluster.dataDir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
  if (result.status !== 0) throw new Error(`initdb failed: ${result.stderr || result.stdout}`);
  return true;
}

export function isRunning(cluster: Cluster): boolean {
  return runServerCommand('pg_ctl', ['-D', cluster.dataDir, 'status'], { quiet: true }).status === 0;
}

export function startCluster(cluster: Cluster) {
  if (isRunning(cluster)) return false;
  fs.mkdirSync(cluster.socketDir, { recursive: true });
  ownByServerUser(cluster.socketDir);
  const logFile = path.join(cluster.dataDir, 'server.log');
  const speedOverSafety = cluster.durable ? '' : ' -c fsync=off -c synchronous_commit=off -c full_page_writes=off';
  const options = `-c listen_addresses=127.0.0.1 -p ${cluster.port} -k ${cluster.socketDir} -c max_connections=200${speedOverSafety}`;
  const result = runServerCommand('pg_ctl', ['-D', cluster.dataDir, '-l', logFile, '-o', options, '-w', '-t', '60', 'start']);
  if (result.status !== 0) {
    const log = fs.existsSync(logFile) ? fs.readFileSync(logFile, 'utf8').split('\n').slice(-15).join('\n') : '';
    throw new Error(`PostgreSQL did not start on port ${cluster.port}: ${result.stderr}\n${log}`);
  }
  return true;
}

export function stopCluster(cluster: Cluster) {
  if (!isRunning(cluster)) return;
  runServerCommand('pg_ctl', ['-D', cluster.dataDir, '-m', 'fast', '-w', 'stop'], { quiet: true });
}

export function databaseUrl(cluster: Cluster, database: string) {
  return `postgres://postgres@127.0.0.1:${cluster.port}/${database}`;
}

/** Creates the database and the PostGIS extension when they are missing. */
export async function ensureDatabase(cluster: Cluster, database: string) {
  const admin = new pg.Client({ connectionString: databaseUrl(cluster, 'postgres') });
  await admin.connect();
  try {
    const found = await admin.query('SELECT 1 FROM pg_database WHERE datname = $1', [database]);
    if (found.rowCount === 0) await admin.query(`CREATE DATABASE "${database.replace(/"/g, '')}"`);
  } finally {
    await admin.end();
  }
  const client = new pg.Client({ connectionString: databaseUrl(cluster, database) });
  await client.connect();
  try {
    await client.query('CREATE EXTENSION IF NOT EXISTS postgis');
  } finally {
    await client.end();
  }
}
