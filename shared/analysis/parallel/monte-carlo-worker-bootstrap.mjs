// Worker entry in plain JavaScript: registers tsx's loader inside the thread, then loads the TypeScript body.
import { register } from 'tsx/esm/api';

register();
await import('./monte-carlo-worker.ts');
