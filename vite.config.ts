import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import { VitePWA } from 'vite-plugin-pwa';
import { fileURLToPath } from 'node:url';

const sharedDir = fileURLToPath(new URL('./shared', import.meta.url));

// Suites that need the throwaway database run one file at a time: each starts the app in-process
// against the one database, and the fault suites kill and restart processes around it.
const serialSuite = { fileParallelism: false, testTimeout: 60_000, hookTimeout: 120_000 } as const;
// Projects run one after another (unit first, for the quickest word): the fault suites restart the database.
const inOrder = (groupOrder: number) => ({ sequence: { groupOrder } });

// The installable scout app: a manifest and our own service worker (src/sw.ts), its precache list filled in by Workbox.
const pwa = VitePWA({
  strategies: 'injectManifest',
  srcDir: 'src',
  filename: 'sw.ts',
  registerType: 'autoUpdate',
  injectRegister: false,
  injectManifest: { globPatterns: ['**/*.{js,css,html,svg,png,woff2}'], maximumFileSizeToCacheInBytes: 4 * 1024 * 1024 },
  includeAssets: ['icons/apple-touch-icon.png'],
  manifest: {
    name: 'Patchwise',
    short_name: 'Patchwise',
    description: 'Scout fields, record pests and empty stops, and send them when there is signal.',
    start_url: '/',
    scope: '/',
    display: 'standalone',
    orientation: 'portrait',
    background_color: '#fbf8f0',
    theme_color: '#2f5d3a',
    icons: [
      { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
      { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
      { src: '/icons/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
    ],
  },
  devOptions: { enabled: false },
});

export default defineConfig({
  plugins: [react(), pwa],
  resolve: { alias: { '@shared': sharedDir } },
  build: { outDir: 'dist', sourcemap: true },
  server: { proxy: { '/api': `http://127.0.0.1:${process.env.PORT ?? 3000}` } },
  test: {
    environment: 'node',
    projects: [
      {
        extends: true,
        // Every other folder of tests/ (engine, shared rules, client logic, the tooling's own logic): no database, build or network.
        test: {
          name: 'unit',
          ...inOrder(0),
          include: ['tests/**/*.test.ts'],
          exclude: ['tests/api/**', 'tests/e2e/**', 'tests/faults/**', '**/node_modules/**'],
          testTimeout: 30_000,
        },
      },
      { extends: true, test: { name: 'api', ...inOrder(1), include: ['tests/api/**/*.test.ts'], globalSetup: ['tests/global-setup.ts'], ...serialSuite } },
      { extends: true, test: { name: 'e2e', ...inOrder(2), include: ['tests/e2e/**/*.test.ts'], globalSetup: ['tests/global-setup.ts'], ...serialSuite } },
      {
        extends: true,
        test: { name: 'faults', ...inOrder(3), include: ['tests/faults/**/*.test.ts'], globalSetup: ['tests/global-setup.ts'], ...serialSuite },
      },
    ],
  },
});
