// Browser journeys: Debian's Chromium through playwright-core, and the real app served in-process.
import fs from 'node:fs';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { chromium, type Browser } from 'playwright-core';

const CHROMIUM = '/usr/bin/chromium';

export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  });
}

export interface TestServer {
  url: string;
  close(): Promise<void>;
}

/**
 * Serves API and built client on a free loopback port. Background workers (thumbnails, notices)
 * start only when a journey asks for them.
 */
export async function startTestServer(options: { workers?: boolean } = {}): Promise<TestServer> {
  const { config } = await import('../../server/config.ts');
  if (!fs.existsSync(path.join(config.clientDir, 'index.html'))) {
    throw new Error(`No built client in ${config.clientDir}: run \`npx vite build\` (npm test does it for you).`);
  }
  if (options.workers) {
    const { startServer } = await import('../../server/index.ts');
    const running = await startServer({ port: 0 });
    return { url: `http://127.0.0.1:${(running.server.address() as AddressInfo).port}`, close: running.close };
  }
  const { createApp } = await import('../../server/app.ts');
  const app = createApp();
  const server = await new Promise<Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  return {
    url: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}
