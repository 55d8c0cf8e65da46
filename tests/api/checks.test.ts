import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mean } from 'simple-statistics';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { addSightings, makeField, makePest, makeScoutedField, makeWalk, TEST_FIELD_CORNER, TEST_FIELD_SIZE, type StopPoint } from '../helpers/sightings.ts';
import { analyse, type AnalysisResult } from '../../shared/analysis/analyse.ts';
import { analysisOptionsSchema } from '../../shared/analysis/options.ts';
import { createRandom } from '../../shared/analysis/random.ts';
import { startWorkers } from '../../server/jobs/workers.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import '../../server/jobs/all-workers.ts';
import { closeSimulationPool, INLINE_WORK_LIMIT } from '../../server/services/check-runner.ts';

/** The options a check runs with: the adviser's, plus the test pest's library threshold for its zones. */
const withLibraryThreshold = <T extends object>(options: T) => ({ ...options, zones: { actionThreshold: 2, unit: 'aphids per plant' } });
import { expectServedAsComputed, fetchCheckPart, withCheckParts } from '../helpers/check-parts.ts';

// Invented sightings: two tight patches (clustered) or uniform over the field (for changes and access tests).
function patchyStops(seed: number, perPatch = 20): StopPoint[] {
  const random = createRandom(seed);
  const centres = [
    [TEST_FIELD_CORNER.lon + TEST_FIELD_SIZE.lon * 0.25, TEST_FIELD_CORNER.lat + TEST_FIELD_SIZE.lat * 0.3],
    [TEST_FIELD_CORNER.lon + TEST_FIELD_SIZE.lon * 0.7, TEST_FIELD_CORNER.lat + TEST_FIELD_SIZE.lat * 0.7],
  ];
  const patches = centres.flatMap(([lon, lat]) =>
    Array.from({ length: perPatch }, () => ({
      lon: lon + (random() - 0.5) * 0.0003,
      lat: lat + (random() - 0.5) * 0.0002,
      count: 3 + Math.floor(random() * 6),
    })),
  );
  // Empty stops on a 6 × 4 grid across the field: the walk recorded where it found nothing, so the check has a stops design.
  const empty = Array.from({ length: 24 }, (_, k) => ({
    lon: TEST_FIELD_CORNER.lon + (TEST_FIELD_SIZE.lon * ((k % 6) + 0.5)) / 6,
    lat: TEST_FIELD_CORNER.lat + (TEST_FIELD_SIZE.lat * (Math.floor(k / 6) + 0.5)) / 4,
    count: 0,
  }));
  return [...patches, ...empty];
}

function scatteredStops(seed: number, n: number): StopPoint[] {
  const random = createRandom(seed);
  return Array.from({ length: n }, () => ({
    lon: TEST_FIELD_CORNER.lon + TEST_FIELD_SIZE.lon * (0.02 + 0.96 * random()),
    lat: TEST_FIELD_CORNER.lat + TEST_FIELD_SIZE.lat * (0.02 + 0.96 * random()),
    count: Math.floor(random() * 4),
  }));
}

/** The engine's inputs rebuilt from what the test inserted: sightings by id, as the server orders them. */
function engineSightings(ids: string[], points: StopPoint[], walk: string) {
  const byId = ids.map((id, i) => ({ id, point: points[i] })).sort((a, b) => (a.id < b.id ? -1 : 1));
  return {
    type: 'FeatureCollection' as const,
    features: byId.map(({ id, point }) => ({
      type: 'Feature' as const,
      geometry: { type: 'Point' as const, coordinates: [point.lon, point.lat] },
      properties: point.count === null ? { id, walk } : { id, count: point.count, walk },
    })),
  };
}

const withoutTimings = (result: unknown) => {
  const { timingsMs: _timings, ...rest } = JSON.parse(JSON.stringify(result)) as AnalysisResult;
  return rest;
};

let org: TestOrganisation;
let adviser: Client;

beforeAll(async () => {
  org = await makeOrganisation('Checks');
  adviser = await signedIn(org.users.adviser.email);
});

afterAll(async () => {
  await stopQueue();
  await closeSimulationPool();
});

describe('running a pattern check', () => {
  it('stores exactly the figures the engine gives for the same sightings and options', async () => {
    const points = patchyStops(11);
    const { field, pest, walkId, sightingIds } = await makeScoutedField(org, points);
    const options = { simulations: 199, seed: 7 };
    const res = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options });
    expect(res.status).toBe(201);
    const { check } = res.body;
    expect(check.status).toBe('done');
    expect(check.progress).toBe(1);
    expect(check.reused).toBe(false);
    expect(check.createdBy).toEqual({ id: org.users.adviser.id, name: org.users.adviser.name });
    expect(check.sightingCount).toBe(sightingIds.length);
    expect((await fetchCheckPart(adviser, check.id, 'sighting-ids')).sightingIds).toEqual([...sightingIds].sort());
    // The pest library's action threshold joins the options (tests/helpers/sightings.ts: 2 aphids per plant).
    const asRun = withLibraryThreshold(options);
    expect(check.options).toEqual(analysisOptionsSchema.parse(asRun));
    expect(check.engineVersion).toBe(analyse(field.boundary, engineSightings(sightingIds, points, walkId), asRun).engineVersion);

    // No second computation: the page's figures are the engine's own, run here on the same inputs.
    const reference = analyse(field.boundary, engineSightings(sightingIds, points, walkId), asRun);
    await expectServedAsComputed(withoutTimings(await withCheckParts(adviser, check)), withoutTimings(reference));
    expect(check.result.spread.verdict).toBe('clustered');
  });

  it('stores the design, the same-stop merges and the not-scouted area with the check', async () => {
    const points = patchyStops(13);
    const { field, pest } = await makeScoutedField(org, points);
    const { check } = (await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 99 } }).expect(201)).body;
    expect(check.design).toBe('stops');
    const { merges } = await fetchCheckPart(adviser, check.id, 'stops');
    expect(check.stopMerges).toBe(merges.length);
    const [row] = await sequelize.query<{ design: string; merges: number; notScoutedM2: number; area: number; srid: number }>(
      `SELECT design, jsonb_array_length(stop_merges) AS merges, not_scouted_m2 AS "notScoutedM2",
              ST_Area(not_scouted::geography) AS area, ST_SRID(not_scouted) AS srid
         FROM pattern_checks WHERE id = :id`,
      { replacements: { id: check.id }, type: QueryTypes.SELECT },
    );
    expect(row.design).toBe('stops');
    expect(row.merges).toBe(merges.length);
    expect(row.srid).toBe(4326);
    // PostGIS measures the stored polygon on the spheroid; the engine in UTM: within 1 %.
    expect(Math.abs(row.area / row.notScoutedM2 - 1)).toBeLessThan(0.01);
  });

  it('answers a repeat with the stored check, same id and same result', async () => {
    const { field, pest } = await makeScoutedField(org, patchyStops(12));
    const body = { fieldId: field.id, pestId: pest.id, options: { simulations: 99, seed: 3 } };
    const first = await adviser.post('/api/checks', body).expect(201);
    const again = await adviser.post('/api/checks', body).expect(200);
    expect(again.body.check.id).toBe(first.body.check.id);
    expect(again.body.check.reused).toBe(true);
    expect(again.body.check.result).toEqual(first.body.check.result);
    // Defaults written out count as the same options.
    const spelledOut = await adviser.post('/api/checks', { ...body, options: { ...body.options, alpha: 0.05, kernel: 'quartic' } }).expect(200);
    expect(spelledOut.body.check.id).toBe(first.body.check.id);
    const [{ n }] = await sequelize.query<{ n: number }>('SELECT count(*) AS n FROM pattern_checks WHERE field_id = :id', {
      replacements: { id: field.id },
      type: QueryTypes.SELECT,
    });
    expect(n).toBe(1);
  });

  it('runs again when a sighting is added or edited', async () => {
    const points = scatteredStops(21, 30);
    const { field, pest, walkId, sightingIds } = await makeScoutedField(org, points);
    const body = { fieldId: field.id, pestId: pest.id, options: { simulations: 99 } };
    const first = (await adviser.post('/api/checks', body).expect(201)).body.check;

    const added = { lon: TEST_FIELD_CORNER.lon + 0.001, lat: TEST_FIELD_CORNER.lat + 0.001, count: 9 };
    const [newId] = await addSightings(org, { fieldId: field.id, walkId, pestId: pest.id }, [added]);
    const second = (await adviser.post('/api/checks', body).expect(201)).body.check;
    expect(second.id).not.toBe(first.id);
    const idsOf = async (check: { id: string }) => (await fetchCheckPart(adviser, check.id, 'sighting-ids')).sightingIds as string[];
    expect(await idsOf(second)).toContain(newId);
    expect(second.sightingsHash).not.toBe(first.sightingsHash);
    expect(second.result.n).toBe(first.result.n + 1);

    await sequelize.query('UPDATE sightings SET count = 40, updated_at = now() WHERE id = :id', { replacements: { id: sightingIds[0] } });
    const third = (await adviser.post('/api/checks', body).expect(201)).body.check;
    expect(third.id).not.toBe(second.id);
    expect(await idsOf(third)).toEqual(await idsOf(second));
    expect(third.sightingsHash).not.toBe(second.sightingsHash);
    const reference = analyse(
      field.boundary,
      engineSightings([...sightingIds, newId], [{ ...points[0], count: 40 }, ...points.slice(1), added], walkId),
      withLibraryThreshold(body.options),
    );
    await expectServedAsComputed(withoutTimings(await withCheckParts(adviser, third)), withoutTimings(reference));
  });

  it('refuses invalid options with an error that names the option', async () => {
    const { field, pest } = await makeScoutedField(org, scatteredStops(31, 12));
    const negative = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: -5 } });
    expect(negative.status).toBe(400);
    expect(negative.body.error.message).toMatch(/simulations/i);
    expect(negative.body.error.fields['options.simulations']).toBeTruthy();

    const unknown = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { cellsize: 20 } });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.message).toContain('"cellsize" is not a check option');

    const basis = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { areaBasis: 'county' } });
    expect(basis.status).toBe(400);
    expect(basis.body.error.message).toMatch(/areaBasis.*boundary, bbox, hull or custom/);

    // The engine's own refusal (a bounding rectangle of one sighting has no area) comes back as a 400, not a stored failure.
    const lone = await makeScoutedField(org, scatteredStops(32, 1));
    const zeroArea = await adviser.post('/api/checks', { fieldId: lone.field.id, pestId: lone.pest.id, options: { areaBasis: 'bbox' } });
    expect(zeroArea.status).toBe(400);
    expect(zeroArea.body.error.message).toMatch(/bbox area is zero/);
    const [{ n }] = await sequelize.query<{ n: number }>('SELECT count(*) AS n FROM pattern_checks WHERE field_id = :id', {
      replacements: { id: lone.field.id },
      type: QueryTypes.SELECT,
    });
    expect(n).toBe(0);

    const window = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, from: '2026-08-01', to: '2026-07-01' });
    expect(window.status).toBe(400);
    expect(window.body.error.fields.to).toMatch(/from date/);
  });
});

describe('who may see checks', () => {
  it('refuses another organisation’s field and check as not found', async () => {
    const { field, pest } = await makeScoutedField(org, scatteredStops(41, 12));
    const own = (await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 19 } }).expect(201)).body.check;
    const other = await makeOrganisation('Other');
    const outsider = await signedIn(other.users.adviser.email);
    const otherPest = await makePest(other);
    expect((await outsider.post('/api/checks', { fieldId: field.id, pestId: otherPest.id })).status).toBe(404);
    expect((await outsider.get(`/api/checks/${own.id}`)).status).toBe(404);
    expect((await outsider.get(`/api/fields/${field.id}/checks`)).status).toBe(404);
    expect((await outsider.get(`/api/fields/${field.id}/threshold-status`)).status).toBe(404);
    expect((await outsider.get(`/api/fields/${field.id}/history`)).status).toBe(404);
  });

  it('refuses scouts and growers', async () => {
    const { field, pest } = await makeScoutedField(org, scatteredStops(42, 12));
    const own = (await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 19 } }).expect(201)).body.check;
    for (const role of ['scout', 'grower'] as const) {
      const client = await signedIn(org.users[role].email);
      expect((await client.post('/api/checks', { fieldId: field.id, pestId: pest.id })).status).toBe(403);
      expect((await client.get(`/api/checks/${own.id}`)).status).toBe(403);
      expect((await client.get(`/api/fields/${field.id}/checks`)).status).toBe(403);
      expect((await client.post('/api/checks/sensitivity', { fieldId: field.id, pestId: pest.id })).status).toBe(403);
      expect((await client.get('/api/advisers/attention')).status).toBe(403);
    }
    const admin = await signedIn(org.users.admin.email);
    expect((await admin.get(`/api/checks/${own.id}`)).status).toBe(200);
  });
});

describe('heavy checks', () => {
  it('runs as a background job that reaches done with progress, with the engine’s figures', async () => {
    await startWorkers();
    const points = patchyStops(51, 25);
    const { field, pest, walkId, sightingIds } = await makeScoutedField(org, points);
    const options = { simulations: 9999, seed: 5 };
    expect(options.simulations * points.length).toBeGreaterThan(INLINE_WORK_LIMIT);
    const res = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options });
    expect(res.status).toBe(202);
    expect(res.body.check.status).toBe('queued');
    expect(res.body.check.result).toBeNull();

    const seen: Array<{ status: string; progress: number }> = [];
    let check = res.body.check;
    while (check.status === 'queued' || check.status === 'running') {
      await new Promise((resolve) => setTimeout(resolve, 50));
      check = (await adviser.get(`/api/checks/${check.id}`).expect(200)).body.check;
      seen.push({ status: check.status, progress: check.progress });
    }
    expect(check.error).toBeNull();
    expect(check.status).toBe('done');
    expect(check.progress).toBe(1);
    const progress = seen.map((s) => s.progress);
    expect(progress).toEqual([...progress].sort((a, b) => a - b));
    expect(check.finishedAt).not.toBeNull();

    // Simulations ran on worker threads; the single-threaded engine gives the same figures.
    const reference = analyse(field.boundary, engineSightings(sightingIds, points, walkId), withLibraryThreshold(options));
    await expectServedAsComputed(withoutTimings(await withCheckParts(adviser, check)), withoutTimings(reference));
  });
});

describe('sensitivity strip', () => {
  it('gives the engine’s verdict and figures at each cell size and area basis', async () => {
    const points = patchyStops(61);
    const { field, pest, walkId, sightingIds } = await makeScoutedField(org, points);
    const res = await adviser.post('/api/checks/sensitivity', { fieldId: field.id, pestId: pest.id, options: { seed: 2 } });
    expect(res.status).toBe(200);
    expect(res.body.simulations).toBe(199);
    expect(res.body.rows).toHaveLength(9);
    const sightings = engineSightings(sightingIds, points, walkId);
    const side = analyse(field.boundary, sightings, { seed: 2, simulations: 199 }).quadrat!.cellSizeM!;
    for (const row of res.body.rows) {
      const result = analyse(field.boundary, sightings, { seed: 2, simulations: 199, areaBasis: row.areaBasis, cellSizeM: side * row.cellSizeFactor });
      expect(row).toMatchObject({
        verdict: result.spread.verdict,
        R: result.nearestNeighbour!.R,
        z: result.nearestNeighbour!.z,
        pValue: result.nearestNeighbour!.pValue,
        donnellyR: result.nearestNeighbour!.donnelly.R,
        monteCarloPValue: result.nearestNeighbour!.monteCarlo.pValue,
        chiSquare: result.quadrat!.chiSquare,
        quadratPValue: result.quadrat!.pValue,
      });
      expect(row.cellSizeM).toBeCloseTo(side * row.cellSizeFactor, 9);
    }
    expect(new Set(res.body.rows.map((r: { areaBasis: string }) => r.areaBasis))).toEqual(new Set(['boundary', 'bbox', 'hull']));
  });
});

describe('a field’s checks, threshold status and history', () => {
  it('lists the field’s checks newest first with their verdicts', async () => {
    const { field, pest } = await makeScoutedField(org, patchyStops(71));
    const a = (await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 99, seed: 1 } }).expect(201)).body.check;
    const b = (await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 99, seed: 2 } }).expect(201)).body.check;
    const res = await adviser.get(`/api/fields/${field.id}/checks`).expect(200);
    expect(res.body.checks.map((c: { id: string }) => c.id)).toEqual([b.id, a.id]);
    expect(res.body.checks[0]).toMatchObject({ verdict: b.result.spread.verdict, n: b.result.n, pestName: pest.name, status: 'done' });
    expect(res.body.checks[0].result).toBeUndefined();
  });

  it('reports each walk above, below, too close or too few to call, with the exact Poisson interval of the mean per stop', async () => {
    const field = await makeField(org);
    const pest = await makePest(org, { actionThreshold: 2, countUnit: 'larvae per seedling' });
    const at = (i: number) => ({ lon: TEST_FIELD_CORNER.lon + 0.0004 * (i + 1), lat: TEST_FIELD_CORNER.lat + 0.0002 * ((i % 10) + 1) });
    const walks = {
      above: { date: '2026-06-01', counts: [4, 4, 4, 4, 4] },
      below: { date: '2026-06-08', counts: [0, 0, 1, 0, 0, 1, 0, 0, 0, 1] },
      close: { date: '2026-06-15', counts: [2, 2, 2, 2, 2] },
      few: { date: '2026-06-22', counts: [9, 9, 9] },
    };
    // Garwood (1936), Table 1: exact 95 % limits for Poisson totals 20, 3 and 10, divided by the stops.
    const limits = { above: [12.217 / 5, 30.888 / 5], below: [0.6187 / 10, 8.767 / 10], close: [4.7954 / 5, 18.39 / 5] } as const;
    const walkIds: Record<string, string> = {};
    for (const [label, walk] of Object.entries(walks)) {
      walkIds[label] = await makeWalk(org, field.id, walk.date);
      await addSightings(
        org,
        { fieldId: field.id, walkId: walkIds[label], pestId: pest.id },
        walk.counts.map((count, i) => ({ ...at(i), count })),
      );
    }
    const res = await adviser.get(`/api/fields/${field.id}/threshold-status?pestId=${pest.id}`).expect(200);
    expect(res.body.statuses).toHaveLength(4);
    const byWalk = new Map(res.body.statuses.map((s: { walkId: string }) => [s.walkId, s]));
    const expected = { above: 'above', below: 'below', close: 'too-close', few: 'too-few' } as const;
    for (const [label, walk] of Object.entries(walks)) {
      const status = byWalk.get(walkIds[label]) as Record<string, never> & { meanInterval: { low: number; high: number } };
      expect(status).toMatchObject({
        status: expected[label as keyof typeof expected],
        stops: walk.counts.length,
        actionThreshold: 2,
        thresholdSource: 'Test threshold, not agronomic advice',
      });
      if (label === 'few') continue;
      const [low, high] = limits[label as keyof typeof limits];
      expect(status.meanInterval.low).toBeCloseTo(low, 3);
      expect(status.meanInterval.high).toBeCloseTo(high, 2);
    }
    const one = await adviser.get(`/api/fields/${field.id}/threshold-status?walkId=${walkIds.close}`).expect(200);
    expect(one.body.statuses).toHaveLength(1);
    expect(one.body.statuses[0].sentence).toMatch(/too close to call — scout again/i);
  });

  it('shows the season’s walks with sightings and mean count per walk, and past checks', async () => {
    const points = patchyStops(81, 10);
    const { field, pest, walkId } = await makeScoutedField(org, points, { walkedOn: '2026-06-20' });
    const laterWalk = await makeWalk(org, field.id, '2026-07-04');
    const later: StopPoint[] = [...patchyStops(82, 6), ...scatteredStops(83, 5).map((p) => ({ ...p, count: 0 }))];
    await addSightings(org, { fieldId: field.id, walkId: laterWalk, pestId: pest.id }, later);
    const check = (await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 19 } }).expect(201)).body.check;

    const res = await adviser.get(`/api/fields/${field.id}/history?pestId=${pest.id}`).expect(200);
    expect(res.body.walks.map((w: { walkId: string }) => w.walkId)).toEqual([walkId, laterWalk]);
    const [first, second] = res.body.walks;
    expect(first.pests[0]).toMatchObject({ pestId: pest.id, sightings: points.filter((p) => (p.count as number) > 0).length, stops: points.length });
    expect(first.pests[0].meanCount).toBeCloseTo(mean(points.map((p) => p.count as number)), 10);
    expect(second.pests[0]).toMatchObject({ sightings: 12, stops: 12 + 24 + 5 });
    expect(second.pests[0].meanCount).toBeCloseTo(mean(later.map((p) => p.count as number)), 10);
    expect(res.body.checks.map((c: { id: string }) => c.id)).toEqual([check.id]);
  });
});

describe('the adviser’s attention list', () => {
  it('lists a clustered pest above its threshold and sightings not yet checked, each opening its page, for the own organisation only', async () => {
    const home = await makeOrganisation('Attention');
    const homeAdviser = await signedIn(home.users.adviser.email);
    const patchy = await makeScoutedField(home, patchyStops(91), { pest: { actionThreshold: 2 } });
    await homeAdviser.post('/api/checks', { fieldId: patchy.field.id, pestId: patchy.pest.id, options: { simulations: 99 } }).expect(201);
    const unchecked = await makeScoutedField(home, scatteredStops(92, 8));
    // Two places the scout looked and found nothing: empty stops, named apart from the sightings.
    await addSightings(home, { fieldId: unchecked.field.id, walkId: unchecked.walkId, pestId: unchecked.pest.id }, [
      { lon: TEST_FIELD_CORNER.lon + TEST_FIELD_SIZE.lon * 0.41, lat: TEST_FIELD_CORNER.lat + TEST_FIELD_SIZE.lat * 0.37, count: 0 },
      { lon: TEST_FIELD_CORNER.lon + TEST_FIELD_SIZE.lon * 0.63, lat: TEST_FIELD_CORNER.lat + TEST_FIELD_SIZE.lat * 0.58, count: 0 },
    ]);

    const res = await homeAdviser.get('/api/advisers/attention').expect(200);
    expect(res.body.aboveThreshold.map((a: { fieldId: string }) => a.fieldId)).toEqual([patchy.field.id]);
    expect(res.body.aboveThreshold[0].meanPerStop).toBeCloseTo(mean(patchyStops(91).map((p) => p.count as number)), 10);
    expect(res.body.notYetChecked.map((a: { fieldId: string }) => a.fieldId)).toEqual([unchecked.field.id]);
    // Count 0 without a photo is how an empty stop is stored (server/queries/sightings.ts, isEmptyStop): the scattered stops' own zeros and the two added above.
    const empty = scatteredStops(92, 8).filter((p) => p.count === 0).length + 2;
    expect(res.body.notYetChecked[0]).toMatchObject({ newSightings: 10, emptyStops: empty });
    expect(res.body.notYetChecked[0].message).toBe(
      `10 stops for ${unchecked.pest.name} in ${unchecked.field.name} not yet checked: ${10 - empty} with ${unchecked.pest.name}, ${empty} empty.`,
    );
    // A threshold of 2 in the pest's unit (the helper's "aphids per plant"), plural for 2 (CLDR English: "one" only for 1).
    expect(res.body.aboveThreshold[0].thresholdWords).toBe('2 aphids per plant');
    expect(res.body.aboveThreshold[0].link).toBe(`/fields/${patchy.field.id}/review?pest=${patchy.pest.id}&check=${res.body.aboveThreshold[0].checkId}`);
    expect(res.body.notYetChecked[0].link).toBe(`/fields/${unchecked.field.id}/review?pest=${unchecked.pest.id}`);
    expect(res.body.unacknowledgedNotices).toEqual([]);

    // A sighting added after the check puts the checked field back on the list.
    await addSightings(home, { fieldId: patchy.field.id, walkId: patchy.walkId, pestId: patchy.pest.id }, [
      { lon: TEST_FIELD_CORNER.lon + 0.002, lat: TEST_FIELD_CORNER.lat + 0.001, count: 1 },
    ]);
    const after = await homeAdviser.get('/api/advisers/attention').expect(200);
    const again = after.body.notYetChecked.find((a: { fieldId: string }) => a.fieldId === patchy.field.id);
    expect(again).toMatchObject({ newSightings: 1, reason: 'not-yet-checked' });
  });
});
