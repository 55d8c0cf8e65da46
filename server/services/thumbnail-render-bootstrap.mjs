// Worker-thread entry in plain JavaScript: registers tsx's loader inside the thread (loader flags of the
// parent do not reach workers on Node 20), then hands piscina the TypeScript renderer.
import { register } from 'tsx/esm/api';

register();
const { renderThumbnail } = await import('./thumbnail-render.ts');
export default renderThumbnail;
