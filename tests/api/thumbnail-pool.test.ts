// Render threads yield to the API's thread: Linux keeps a nice value per thread (proc(5), /proc/[pid]/task/[tid]/stat
// field 19), and the pool's threads carry the raised value while the main thread keeps its own.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { closeThumbnailPool, renderInPool } from '../../server/services/thumbnail-pool.ts';
import { BACKGROUND_THREAD_NICE } from '../../server/services/background-priority.ts';
import { makeJpeg } from '../helpers/photos.ts';

/** Field 19 of a task's stat line; the command name in parentheses may hold spaces, so count after it. */
const niceOf = (statFile: string) => {
  const stat = fs.readFileSync(statFile, 'utf8');
  return Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[16]);
};

afterAll(() => closeThumbnailPool());

describe.runIf(process.platform === 'linux')('thumbnail render threads', () => {
  it('run at a lower priority than the thread that answers requests', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'patchwise-nice-'));
    try {
      const file = path.join(dir, 'leaf.jpg');
      fs.writeFileSync(file, await makeJpeg({ width: 1200, height: 900, markSeed: 11 }));
      const mainNice = niceOf('/proc/self/stat');
      const rendered = await renderInPool({ path: file, mimeType: 'image/jpeg', orientation: 1 });
      expect(rendered.bytes.length).toBeGreaterThan(0);
      // The pool keeps its thread for a while after the job (idleTimeout), so it can be read now.
      const nices = fs.readdirSync('/proc/self/task').map((tid) => niceOf(`/proc/self/task/${tid}/stat`));
      expect(nices).toContain(Math.min(19, mainNice + BACKGROUND_THREAD_NICE));
      expect(niceOf(`/proc/self/task/${process.pid}/stat`)).toBe(mainNice);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
