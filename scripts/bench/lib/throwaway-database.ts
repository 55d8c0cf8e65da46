// A throwaway PostgreSQL/PostGIS cluster for a benchmark, set up the way `npm test` does it: own folder,
// free loopback port, migrated schema. Call it before importing any server module (they read
// DATABASE_URL on import); `dispose()` stops the cluster and removes its folder.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { clusterFor, databaseUrl, ensureDatabase, initCluster, startCluster, stopCluster } from '../../lib/postgres.ts';
import { freePort } from '../../lib/free-port.ts';
import { projectRoot } from '../../lib/local-env.ts';

export interface ThrowawayDatabase {
  url: string;
  workDir: string;
  dispose(): void;
}

export async function startThrowawayDatabase(label: string): Promise<ThrowawayDatabase> {
  const workDir = fs.mkdtempSync(path.join(os.tmpdir(), `patchwise-bench-${label}-`));
  fs.chmodSync(workDir, 0o755);
  const cluster = clusterFor(path.join(workDir, 'postgres'), await freePort());
  const dispose = () => {
    try {
      stopCluster(cluster);
    } finally {
      fs.rmSync(workDir, { recursive: true, force: true });
    }
  };
  try {
    initCluster(cluster);
    startCluster(cluster);
    await ensureDatabase(cluster, 'patchwise_bench');
    const url = databaseUrl(cluster, 'patchwise_bench');
    // Migrations run in a child process so this process's server modules have not yet read their config.
    const migrate = spawnSync('node', ['--import', 'tsx', 'scripts/migrate.ts'], {
      cwd: projectRoot,
      env: { ...process.env, DATABASE_URL: url },
      encoding: 'utf8',
    });
    if (migrate.status !== 0) throw new Error(`Migrations failed: ${migrate.stderr || migrate.stdout}`);
    process.env.DATABASE_URL = url;
    process.env.UPLOAD_DIR ??= path.join(workDir, 'uploads');
    process.env.SESSION_SECRET ??= 'patchwise-bench-secret-not-for-production';
    process.env.TILE_URL ??= 'http://127.0.0.1:9/{z}/{x}/{y}.png';
    process.env.MAIL_CATCHER ??= 'off';
    return { url, workDir, dispose };
  } catch (error) {
    dispose();
    throw error;
  }
}
