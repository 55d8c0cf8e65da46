// Imports each worker module so it registers itself with defineWorker(); add new workers here.
export const workerModules = [] as const;
