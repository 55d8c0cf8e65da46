// Imports each worker module so it registers itself with defineWorker(); add new workers here.
import './check-worker.ts';
import './notice-worker.ts';

export const workerModules = ['check-worker', 'notice-worker'] as const;
