// Worker-thread entry in plain JavaScript: registers tsx's loader inside the thread (loader flags of the
// parent do not reach workers on Node 20), then hands piscina the TypeScript task runner.
import { register } from 'tsx/esm/api';

register();
const { runAnalysisTask } = await import('./analysis-thread.ts');
export default runAnalysisTask;
