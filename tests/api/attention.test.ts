// The adviser's attention list: each situation that needs action, built through the API and the tables, gives its
// line with the link that opens exactly that check, zone set or field — and another organisation never sees it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mean } from 'simple-statistics';
import { booleanPointInPolygon } from '@turf/turf';
import { sequelize } from '../../server/db.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';
import { signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { addSightings, makeScoutedField, makeWalk, TEST_FIELD_CORNER, TEST_FIELD_SIZE, type StopPoint } from '../helpers/sightings.ts';
import { acceptProposedZones, makeCheckedField } from '../helpers/zones.ts';
import { createRandom } from '../../shared/analysis/random.ts';

interface Line {
  fieldId: string;
  pestId: string;
  reason: string;
  link: string;
  checkId: string | null;
  zoneSetId: string | null;
  meanPerStop: number | null;
  daysSinceWalk?: number;
  rescoutDays?: number;
  rescoutConfirmed?: boolean;
}

let org: TestOrganisation;
let other: TestOrganisation;
let adviser: Client;
let admin: Client;
let outsider: Client;

beforeAll(async () => {
  org = await makeOrganisation('Attention list');
  other = await makeOrganisation('Attention outsider');
  adviser = await signedIn(org.users.adviser.email);
  admin = await signedIn(org.users.admin.email);
  outsider = await signedIn(other.users.adviser.email);
});

afterAll(async () => {
  await closeSimulationPool();
});

const attention = async (client: Client) => (await client.get('/api/advisers/attention').expect(200)).body;
const linesFor = (lines: Line[], fieldId: string) => lines.filter((l) => l.fieldId === fieldId);
const setThreshold = (pestId: string, threshold: number) =>
  sequelize.query('UPDATE pests SET action_threshold = :threshold WHERE id = :pestId', { replacements: { pestId, threshold } });
const daysAgo = (days: number) => new Date(Date.now() - days * 86_400_000).toISOString().slice(0, 10);

/** Invented counts spread evenly over the field (no patch), every stop with the pest. */
function evenStops(seed: number, n: number): StopPoint[] {
  const random = createRandom(seed);
  return Array.from({ length: n }, () => ({
    lon: TEST_FIELD_CORNER.lon + TEST_FIELD_SIZE.lon * (0.02 + 0.96 * random()),
    lat: TEST_FIELD_CORNER.lat + TEST_FIELD_SIZE.lat * (0.02 + 0.96 * random()),
    count: 1 + Math.floor(random() * 4),
  }));
}

async function expectOutsiderSeesNothingOf(fieldId: string) {
  const theirs = await attention(outsider);
  for (const list of ['aboveThreshold', 'tooFewStops', 'notYetChecked', 'rescoutDue', 'unacknowledgedNotices'] as const)
    expect(
      theirs[list].map((l: { fieldId: string }) => l.fieldId),
      list,
    ).not.toContain(fieldId);
}

describe('the adviser’s attention list', () => {
  it('lists a field above its threshold whatever its spread, opening its latest check', async () => {
    const points = evenStops(301, 30);
    const scouted = await makeScoutedField(org, points, { pest: { actionThreshold: 1 }, walkedOn: daysAgo(1) });
    const check = (await adviser.post('/api/checks', { fieldId: scouted.field.id, pestId: scouted.pest.id, options: { simulations: 99 } }).expect(201)).body
      .check;
    expect(check.result.spread.verdict).not.toBe('clustered');

    const lines = linesFor((await attention(adviser)).aboveThreshold, scouted.field.id);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatchObject({
      reason: 'field-above-threshold',
      checkId: check.id,
      link: `/fields/${scouted.field.id}/review?pest=${scouted.pest.id}&check=${check.id}`,
    });
    // The field mean is the plain mean of the stop counts (every stop here has a count).
    expect(lines[0].meanPerStop).toBeCloseTo(mean(points.map((p) => p.count as number)), 10);
    await expectOutsiderSeesNothingOf(scouted.field.id);
  });

  it('lists a field whose latest walk has too few stops as too few to call — scout again, not as above its threshold', async () => {
    const scouted = await makeScoutedField(org, evenStops(311, 30), { pest: { actionThreshold: 1 }, walkedOn: daysAgo(5) });
    const check = (await adviser.post('/api/checks', { fieldId: scouted.field.id, pestId: scouted.pest.id, options: { simulations: 99 } }).expect(201)).body
      .check;
    const before = await attention(adviser);
    expect(linesFor(before.aboveThreshold, scouted.field.id).map((l) => l.reason)).toEqual(['field-above-threshold']);
    expect(linesFor(before.tooFewStops, scouted.field.id)).toEqual([]);

    // A newer walk of three stops, all well above the threshold: too few to call (at least 5 stops, common
    // scouting practice of about five areas per walk), whatever the counts say.
    const walkId = await makeWalk(org, scouted.field.id, daysAgo(1));
    const { lon, lat } = TEST_FIELD_CORNER;
    await addSightings(
      org,
      { fieldId: scouted.field.id, walkId, pestId: scouted.pest.id },
      [1, 2, 3].map((i) => ({ lon: lon + 0.001 * i, lat: lat + 0.001, count: 9 })),
    );

    const after = await attention(adviser);
    expect(linesFor(after.aboveThreshold, scouted.field.id)).toEqual([]);
    const lines = linesFor(after.tooFewStops, scouted.field.id) as Array<Line & { message: string }>;
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatchObject({
      reason: 'too-few-stops',
      checkId: check.id,
      link: `/fields/${scouted.field.id}/review?pest=${scouted.pest.id}&check=${check.id}`,
    });
    expect(lines[0].message).toContain('too few stops to call — scout again');
    // The organisation's default format, en-GB: CLDR's long date "d MMMM y", a calendar day that no time zone shifts.
    const walkDay = new Intl.DateTimeFormat('en-GB', { dateStyle: 'long', timeZone: 'UTC' }).format(new Date(`${daysAgo(1)}T12:00:00Z`));
    expect(lines[0].message).toContain(`The latest walk (${walkDay}) has 3 stops with a count; at least 5 are needed`);
    expect(lines[0].message).not.toMatch(/\d{4}-\d{2}-\d{2}/);
    await expectOutsiderSeesNothingOf(scouted.field.id);
  });

  it('lists a patch above the threshold when the field mean is below it, opening the check’s zones', async () => {
    const scouted = await makeCheckedField(org, adviser, { seed: 31 });
    const fieldMean = mean(scouted.points.map((p) => p.count as number));
    const zones = (scouted.check.result.zones as { features: Array<{ properties: { meanCount: number } }> }).features;
    expect(zones.length).toBeGreaterThan(0);
    const highestZone = Math.max(...zones.map((z) => z.properties.meanCount));
    expect(highestZone).toBeGreaterThan(fieldMean);
    // A threshold between the field mean and the patchiest zone: below it over the field, above it in a patch.
    await setThreshold(scouted.pest.id, (fieldMean + highestZone) / 2);

    const lines = linesFor((await attention(adviser)).aboveThreshold, scouted.field.id);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatchObject({ reason: 'patch-above-threshold', link: `/fields/${scouted.field.id}/zones?checkId=${scouted.checkId}` });
    expect(lines[0].meanPerStop).toBeCloseTo(fieldMean, 10);

    // Above every zone's mean, the field drops off the list.
    await setThreshold(scouted.pest.id, highestZone + 1);
    expect(linesFor((await attention(adviser)).aboveThreshold, scouted.field.id)).toEqual([]);
    await expectOutsiderSeesNothingOf(scouted.field.id);
  });

  it('lists an accepted zone whose sightings average above the threshold, opening that zone set', async () => {
    const scouted = await makeCheckedField(org, adviser, { seed: 37 });
    const zoneSet = await acceptProposedZones(adviser, scouted);
    const fieldMean = mean(scouted.points.map((p) => p.count as number));
    // Each stored zone's mean count over the sightings inside it, by turf's point-in-polygon test.
    const zoneMeans = zoneSet.zones
      .map((zone) => scouted.points.filter((p) => booleanPointInPolygon([p.lon, p.lat], zone.geometry)).map((p) => p.count as number))
      .filter((counts) => counts.length > 0)
      .map((counts) => mean(counts));
    const highest = Math.max(...zoneMeans);
    expect(highest).toBeGreaterThan(fieldMean);
    // Between the field mean and the stored zone's: an accepted zone set is the line's page, before the check's own zones.
    await setThreshold(scouted.pest.id, (fieldMean + highest) / 2);

    const lines = linesFor((await attention(adviser)).aboveThreshold, scouted.field.id);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatchObject({
      reason: 'patch-above-threshold',
      zoneSetId: zoneSet.id,
      link: `/fields/${scouted.field.id}/zones?checkId=${scouted.checkId}&zoneSet=${zoneSet.id}`,
    });
    await expectOutsiderSeesNothingOf(scouted.field.id);
  });

  it('lists a field not walked within its pest’s re-scout interval, and not one walked since', async () => {
    const overdue = await makeScoutedField(org, evenStops(41, 6), { walkedOn: daysAgo(10) });
    const recent = await makeScoutedField(org, evenStops(42, 6), { walkedOn: daysAgo(3) });
    for (const pest of [overdue.pest, recent.pest]) await admin.patch(`/api/pests/${pest.id}`, { rescoutDays: 7 }).expect(200);

    const due: Line[] = (await attention(adviser)).rescoutDue;
    const line = linesFor(due, overdue.field.id);
    expect(line).toHaveLength(1);
    expect(line[0]).toMatchObject({
      daysSinceWalk: 10,
      rescoutDays: 7,
      rescoutConfirmed: false,
      link: `/fields/${overdue.field.id}/review?pest=${overdue.pest.id}`,
    });
    expect(linesFor(due, recent.field.id)).toEqual([]);

    // A longer interval in the pest library takes the overdue field off the list.
    await admin.patch(`/api/pests/${overdue.pest.id}`, { rescoutDays: 14, rescoutConfirmed: true }).expect(200);
    expect(linesFor((await attention(adviser)).rescoutDue, overdue.field.id)).toEqual([]);
    await expectOutsiderSeesNothingOf(overdue.field.id);
  });

  it('refuses a re-scout interval that is not a whole number of days from 1 to 365, and keeps the one stored', async () => {
    const scouted = await makeScoutedField(org, evenStops(43, 3), { walkedOn: daysAgo(1) });
    for (const rescoutDays of [0, 2.5, 400]) {
      const res = await admin.patch(`/api/pests/${scouted.pest.id}`, { rescoutDays });
      expect(res.status, String(rescoutDays)).toBe(400);
      expect(JSON.stringify(res.body.error)).toMatch(/re-scout interval/);
    }
    const pests = (await admin.get('/api/pests').expect(200)).body.pests as Array<{ id: string; rescoutDays: number }>;
    expect(pests.find((p) => p.id === scouted.pest.id)?.rescoutDays).toBe(7);
  });
});
