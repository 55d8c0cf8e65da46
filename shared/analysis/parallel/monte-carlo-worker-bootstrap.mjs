// Worker entry in plain JavaScript: lowers the thread's priority when asked, registers tsx's loader inside the
// thread, then loads the TypeScript body.
import { getPriority, setPriority } from 'node:os';
import { workerData } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

// Priority 0 names the calling thread on Linux: only this thread gives way.
if (workerData?.niceIncrement > 0) setPriority(0, Math.min(19, getPriority(0) + workerData.niceIncrement));
register();
await import('./monte-carlo-worker.ts');
