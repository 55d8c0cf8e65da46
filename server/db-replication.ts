// Read replicas for Sequelize (its `replication` option) from DATABASE_URL and DATABASE_REPLICA_URLS: the primary
// takes every write and every transaction, the replicas take plain SELECTs outside transactions.
import type { Options } from 'sequelize';

type Connection = NonNullable<Options['replication']> extends infer R ? (R extends { write: infer W } ? W : never) : never;

/** One postgres:// URL as Sequelize's connection fields; user and password are percent-decoded (RFC 3986). */
export function connectionFrom(url: string): Connection {
  const parsed = new URL(url);
  if (!/^postgres(ql)?:$/.test(parsed.protocol)) throw new Error(`A database URL must start with postgres://, not ${parsed.protocol}//`);
  return {
    host: decodeURIComponent(parsed.hostname),
    port: parsed.port ? Number(parsed.port) : 5432,
    username: decodeURIComponent(parsed.username),
    password: decodeURIComponent(parsed.password),
    database: decodeURIComponent(parsed.pathname.replace(/^\//, '')),
  };
}

/** The replication option, or null when no replica is named (then the one URL serves everything). */
export function replicationFrom(primaryUrl: string, replicaUrls: string[]): Options['replication'] | null {
  if (replicaUrls.length === 0) return null;
  return { write: connectionFrom(primaryUrl), read: replicaUrls.map(connectionFrom) };
}

/** DATABASE_REPLICA_URLS: comma-separated postgres:// URLs, blanks ignored. */
export const replicaUrlsFrom = (value: string | undefined) =>
  (value ?? '')
    .split(',')
    .map((u) => u.trim())
    .filter(Boolean);
