// Whether this process can serve: its database answers, its photo storage takes writes, and it is not stopping.
import { pingDatabase } from '../db.ts';
import { config } from '../config.ts';
import { storageReachable } from './storage.ts';

let stopping = false;

/** Called as a graceful shutdown starts, so the balancer stops sending new requests here. */
export function markStopping() {
  stopping = true;
}

type Check = 'ok' | string;

async function databaseCheck(): Promise<Check> {
  try {
    await pingDatabase();
    return 'ok';
  } catch {
    return 'the database does not answer';
  }
}

async function storageCheck(): Promise<Check> {
  try {
    await storageReachable();
    return 'ok';
  } catch {
    return config.storage.driver === 'file' ? 'the photo storage folder cannot be written' : 'the photo storage bucket does not answer';
  }
}

export async function processReadiness() {
  const [database, storage] = await Promise.all([databaseCheck(), storageCheck()]);
  const shutdown: Check = stopping ? 'this process is stopping' : 'ok';
  return { ready: database === 'ok' && storage === 'ok' && shutdown === 'ok', checks: { database, storage, shutdown } };
}
