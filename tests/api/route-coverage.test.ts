// The access matrix generated from the router: every METHOD + path the app serves under /api must have a row
// in tests/helpers/access-routes.ts (so a new route without one fails here), and every row past the foundation
// ones (which tests/api/access-matrix.test.ts runs) is sent as anonymous, each role and another organisation's admin.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listApiRoutes, rowMatchesRoute, statusesFor } from '../helpers/access-matrix.ts';
import { foundationRoutes, scoutingRoutes } from '../helpers/access-routes.ts';
import { buildScoutingWorld, type ScoutingWorld } from '../helpers/access-scouting.ts';
import { testApp } from '../helpers/http.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeThumbnailPool } from '../../server/services/thumbnail-pool.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';

const allRows = [...foundationRoutes, ...scoutingRoutes];

describe('every route the app serves has a row in the access matrix', () => {
  const routes = listApiRoutes(testApp() as unknown as { router: { stack: unknown[] } });

  it('reads the routes from the router, mounted routers included', () => {
    // A handful the app has served since the foundation, to show the walk reaches nested routers and mount paths.
    expect(routes).toEqual(
      expect.arrayContaining([
        { method: 'GET', path: '/api/fields/:id' },
        { method: 'POST', path: '/api/photos/' },
        { method: 'GET', path: '/api/zone-sets/:id/export.kml' },
      ]),
    );
    expect(routes.length).toBeGreaterThan(60);
  });

  it.each(routes.map((r) => [`${r.method} ${r.path}`, r] as const))('%s has a row', (_label, route) => {
    const rows = allRows.filter((entry) => entry.method === route.method && rowMatchesRoute(entry.path, route.path.replace(/\/$/, '') || '/'));
    expect(rows, `add a row for ${route.method} ${route.path} to tests/helpers/access-routes.ts`).not.toEqual([]);
  });

  it('has no row for a route the app does not serve', () => {
    const stale = allRows.filter(
      (entry) => !routes.some((route) => route.method === entry.method && rowMatchesRoute(entry.path, route.path.replace(/\/$/, '') || '/')),
    );
    expect(stale.map((r) => `${r.method} ${r.path}`)).toEqual([]);
  });
});

describe('access matrix: walks, sightings, photos, checks, zones, notices and the rest, for every caller', () => {
  let world: ScoutingWorld;
  beforeAll(async () => {
    world = await buildScoutingWorld();
  });
  afterAll(async () => {
    await stopQueue();
    await closeThumbnailPool();
    await closeSimulationPool();
  });

  it.each(scoutingRoutes)('$method $path answers each caller as expected', async (entry) => {
    expect(await statusesFor(entry, world)).toEqual(entry.expected);
  });
});
