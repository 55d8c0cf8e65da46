// Imports each worker module so it registers itself with defineWorker(); add new workers here.
import './check-worker.ts';
import './notice-worker.ts';
import './thumbnail-worker.ts';

export const workerModules = ['check-worker', 'notice-worker', 'thumbnail-worker'] as const;
