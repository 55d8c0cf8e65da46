// A check draws its zones against the pest library's action threshold, in the pest's own unit, unless the adviser
// gives one; a threshold on the share of plants infested leaves the zones to relative risk.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { addSightings, makeField, makePest, makeWalk } from '../helpers/sightings.ts';
import { patchyStops } from '../helpers/zones.ts';

let org: TestOrganisation;
let adviser: Client;

beforeAll(async () => {
  org = await makeOrganisation('Check threshold');
  adviser = await signedIn(org.users.adviser.email);
});
afterAll(async () => {
  await closeSimulationPool();
  await stopQueue();
});

async function checkFor(rule: Parameters<typeof makePest>[1], options: Record<string, unknown> = {}) {
  const field = await makeField(org);
  const pest = await makePest(org, rule);
  const walk = await makeWalk(org, field.id);
  await addSightings(org, { fieldId: field.id, walkId: walk, pestId: pest.id }, patchyStops(11));
  const res = await adviser.post('/api/checks', { fieldId: field.id, pestId: pest.id, options: { simulations: 99, seed: 5, ...options } }).expect(201);
  const [stored] = await sequelize.query<{ options: { zones: { actionThreshold?: number; unit?: string } } }>(
    'SELECT options FROM pattern_checks WHERE id = :id',
    {
      replacements: { id: res.body.check.id },
      type: QueryTypes.SELECT,
    },
  );
  return { stored, zones: res.body.check.result.zones.features as Array<{ properties: { threshold: number | null; basis: string } }> };
}

describe('the threshold behind a check’s zones', () => {
  it('is the pest library’s mean-count threshold, in its unit, when the adviser gives none', async () => {
    const { stored, zones } = await checkFor({ actionThreshold: 5, countUnit: 'aphids per plant' });
    expect(stored.options.zones).toMatchObject({ actionThreshold: 5, unit: 'aphids per plant' });
    expect(zones.length).toBeGreaterThan(0);
    for (const zone of zones) expect(zone.properties).toMatchObject({ threshold: 5, basis: 'mean-count' });
  });

  it('is the adviser’s own when given', async () => {
    const { stored } = await checkFor({ actionThreshold: 5 }, { zones: { actionThreshold: 3 } });
    expect(stored.options.zones.actionThreshold).toBe(3);
  });

  it('is left out for a threshold on the share of plants infested, so zones follow relative risk', async () => {
    const { stored, zones } = await checkFor({ actionThreshold: 0.5, thresholdBasis: 'incidence' });
    expect(stored.options.zones.actionThreshold).toBeUndefined();
    for (const zone of zones) expect(zone.properties.basis).toBe('relative-risk');
  });
});
