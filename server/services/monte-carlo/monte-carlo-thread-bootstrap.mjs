// Worker-thread entry in plain JavaScript: registers tsx's loader inside the thread (loader flags of the
// parent do not reach workers on Node 20), then hands piscina the TypeScript chunk runner.
import { register } from 'tsx/esm/api';

register();
const { runChunk } = await import('./monte-carlo-thread.ts');
export default runChunk;
