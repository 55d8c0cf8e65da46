// Every background worker registers here; a web process and a worker-only process both call startWorkers().
import type PgBoss from 'pg-boss';
import { queue } from './queue.ts';

export interface WorkerDefinition {
  name: string;
  start(boss: PgBoss): Promise<void>;
}

const definitions: WorkerDefinition[] = [];

export function defineWorker(definition: WorkerDefinition) {
  definitions.push(definition);
}

export async function startWorkers() {
  const boss = await queue();
  for (const definition of definitions) await definition.start(boss);
  return definitions.map((d) => d.name);
}
