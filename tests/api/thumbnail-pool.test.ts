// Render threads yield to the API's thread: Linux keeps a nice value per thread (proc(5), /proc/[pid]/task/[tid]/stat
// field 19), and the pool's threads carry the raised value while the main thread keeps its own.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { closeThumbnailPool, renderInPool } from '../../server/services/thumbnail-pool.ts';
import { BACKGROUND_THREAD_NICE } from '../../server/services/background-priority.ts';
import { makeJpeg } from '../helpers/photos.ts';
import { mainThreadNice, threadNices } from '../helpers/thread-priority.ts';

afterAll(() => closeThumbnailPool());

describe.runIf(process.platform === 'linux')('thumbnail render threads', () => {
  it('run at a lower priority than the thread that answers requests', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'patchwise-nice-'));
    try {
      const file = path.join(dir, 'leaf.jpg');
      fs.writeFileSync(file, await makeJpeg({ width: 1200, height: 900, markSeed: 11 }));
      const mainNice = mainThreadNice();
      const rendered = await renderInPool({ path: file, mimeType: 'image/jpeg', orientation: 1 });
      expect(rendered.bytes.length).toBeGreaterThan(0);
      // The pool keeps its thread for a while after the job (idleTimeout), so it can be read now.
      expect(threadNices()).toContain(Math.min(19, mainNice + BACKGROUND_THREAD_NICE));
      expect(mainThreadNice()).toBe(mainNice);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
