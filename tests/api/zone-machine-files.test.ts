// Sprayer-ready zone files: ISO 11783-10 task data (read back with the isoxml library) and a shapefile
// (read back with the independent `shapefile` reader), compared with the stored zones and the scouting stops.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { booleanPointInPolygon } from '@turf/turf';
import isoxml from 'isoxml';
import JSZip from 'jszip';
import { read as readShapefile } from 'shapefile';
import type { MultiPolygon, Polygon } from 'geojson';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { stopQueue } from '../../server/jobs/queue.ts';
import { closeSimulationPool } from '../../server/services/check-runner.ts';
import { anonymous, signedIn, type Client } from '../helpers/http.ts';
import { makeOrganisation, type TestOrganisation } from '../helpers/org.ts';
import { TEST_FIELD_CORNER, TEST_FIELD_SIZE } from '../helpers/sightings.ts';
import { makeCheckedField, storedZones, type ScoutedCheck } from '../helpers/zones.ts';
import { issueNoticeToken } from '../../server/services/notice-links.ts';
import { composeNoticeMail } from '../../server/services/notice-mail.ts';
import { noticeMaterial } from '../../server/services/notice-material.ts';

let org: TestOrganisation;
let adviser: Client;
let outsider: Client;
let scouted: ScoutedCheck;
let zoneSet: { id: string; version: number };

const { lon, lat } = TEST_FIELD_CORNER;
const { lon: dLon, lat: dLat } = TEST_FIELD_SIZE;
const box = (x0: number, y0: number, x1: number, y1: number): Polygon => ({
  type: 'Polygon',
  coordinates: [
    [
      [x0, y0],
      [x1, y0],
      [x1, y1],
      [x0, y1],
      [x0, y0],
    ],
  ],
});
// Hand-drawn zones around the two invented patches (tests/helpers/zones.ts places them at 25 %/30 % and 72 %/70 %).
const zoneBoxes = [
  box(lon + dLon * 0.18, lat + dLat * 0.2, lon + dLon * 0.32, lat + dLat * 0.4),
  box(lon + dLon * 0.65, lat + dLat * 0.6, lon + dLon * 0.79, lat + dLat * 0.8),
];

async function acceptHandDrawnZones() {
  const res = await adviser.post(`/api/fields/${scouted.field.id}/zone-sets`, {
    pestId: scouted.pest.id,
    zones: { type: 'FeatureCollection', features: zoneBoxes.map((geometry, i) => ({ type: 'Feature', properties: { label: `Patch ${i + 1}` }, geometry })) },
  });
  expect(res.status).toBe(201);
  return res.body.zoneSet as { id: string; version: number };
}

/** The ellipsoidal area PostGIS gives a geometry read back from a file: the same measure as the stored zones'. */
async function ellipsoidalArea(geometry: Polygon | MultiPolygon) {
  const [row] = await sequelize.query<{ area: number }>('SELECT ST_Area(ST_SetSRID(ST_GeomFromGeoJSON(:g), 4326)::geography, true) AS area', {
    replacements: { g: JSON.stringify(geometry) },
    type: QueryTypes.SELECT,
  });
  return row.area;
}

beforeAll(async () => {
  org = await makeOrganisation('Machine files');
  const other = await makeOrganisation('Machine files other');
  adviser = await signedIn(org.users.adviser.email);
  outsider = await signedIn(other.users.adviser.email);
  scouted = await makeCheckedField(org, adviser, { fieldName: 'Long Meadow' });
  zoneSet = await acceptHandDrawnZones();
});

afterAll(async () => {
  await closeSimulationPool();
  await stopQueue();
});

describe('shapefile export', () => {
  it('reads back with an independent reader as one WGS 84 polygon per zone with the stored areas', async () => {
    const res = await adviser
      .get(`/api/zone-sets/${zoneSet.id}/export.shp.zip`)
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toMatch(/filename="long-meadow-.+-v1\.shp\.zip"/);
    const zip = await JSZip.loadAsync(res.body as Buffer);
    const names = Object.keys(zip.files);
    const base = names.find((n) => n.endsWith('.shp'))!.replace(/\.shp$/, '');
    for (const part of ['.shp', '.shx', '.dbf', '.prj']) expect(names).toContain(`${base}${part}`);
    // The well-known text (WKT) for geographic WGS 84 (the .prj names the datum and the degree unit).
    expect(await zip.file(`${base}.prj`)!.async('string')).toMatch(/GEOGCS\["GCS_WGS_1984",DATUM\["D_WGS_1984"/);

    const collection = await readShapefile(await zip.file(`${base}.shp`)!.async('arraybuffer'), await zip.file(`${base}.dbf`)!.async('arraybuffer'));
    const stored = await storedZones(zoneSet.id);
    expect(collection.features).toHaveLength(stored.length);
    for (const [i, feature] of collection.features.entries()) {
      const geometry = feature.geometry as Polygon | MultiPolygon;
      expect(['Polygon', 'MultiPolygon']).toContain(geometry.type);
      // The issue asks areas to agree within 0.1 %; both sides are measured on the WGS 84 ellipsoid by PostGIS.
      expect(Math.abs((await ellipsoidalArea(geometry)) - stored[i].area_m2) / stored[i].area_m2).toBeLessThan(0.001);
      const attributes = feature.properties as Record<string, unknown>;
      expect(attributes.ZONE).toBe(i + 1);
      expect(attributes.LABEL).toBe(`Patch ${i + 1}`);
      expect(attributes.FIELD).toBe('Long Meadow');
      expect(attributes.PEST).toBe(scouted.pest.name);
      expect(attributes.VERSION).toBe(1);
      expect(attributes.THRESHOLD).toBe(5);
      // International acre (NIST Handbook 44, Appendix C): 4046.8564224 m².
      expect(attributes.AREA_AC as number).toBeCloseTo(stored[i].area_m2 / 4046.8564224, 3);
      expect(attributes.AREA_HA as number).toBeCloseTo(stored[i].area_m2 / 10_000, 3);
      // Mean count per stop inside the zone, counted here from the points the test itself placed.
      const inside = scouted.points.filter((p) => booleanPointInPolygon([p.lon, p.lat], zoneBoxes[i]));
      expect(inside.length).toBeGreaterThan(0);
      expect(attributes.STOPS).toBe(inside.length);
      expect(attributes.MEAN_CNT as number).toBeCloseTo(inside.reduce((s, p) => s + (p.count ?? 0), 0) / inside.length, 3);
    }
    expect(await zip.file('README.TXT')!.async('string')).toMatch(/not what to apply/);
  });
});

describe('ISO 11783-10 task data export', () => {
  async function taskData(client: Client, url: string) {
    const res = await client
      .get(url)
      .buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      });
    return res;
  }

  it('reads back with the isoxml library as the field partfield and a treat / do-not-treat map with no product', async () => {
    const res = await taskData(adviser, `/api/zone-sets/${zoneSet.id}/export.taskdata.zip`);
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toMatch(/filename="long-meadow-.+-v1\.taskdata\.zip"/);
    const manager = new isoxml.ISOXMLManager();
    await manager.parseISOXMLFile(new Uint8Array(res.body as Buffer), 'application/zip');
    expect(manager.getWarnings()).toEqual([]);
    const root = manager.rootElement.attributes;
    const [field] = await sequelize.query<{ area_m2: number; farm_name: string }>(
      'SELECT f.area_m2, fa.name AS farm_name FROM fields f JOIN farms fa ON fa.id = f.farm_id WHERE f.id = :id',
      { replacements: { id: scouted.field.id }, type: QueryTypes.SELECT },
    );
    expect(root.Farm?.[0].attributes.FarmDesignator).toBe(field.farm_name.slice(0, 32));
    const [partfield] = root.Partfield ?? [];
    expect(partfield.attributes.PartfieldDesignator).toBe('Long Meadow');
    const boundary = (partfield as InstanceType<typeof isoxml.ExtendedPartfield>).toGeoJSON() as unknown as MultiPolygon;
    expect(Math.abs((await ellipsoidalArea(boundary)) - field.area_m2) / field.area_m2).toBeLessThan(0.001);

    const [task] = root.Task ?? [];
    expect(task.attributes.PartfieldIdRef).toBeDefined();
    // No product and no rate: the rate is the applicator's, from the label.
    expect(task.attributes.ProductAllocation ?? []).toEqual([]);
    const zones = task.attributes.TreatmentZone ?? [];
    const treat = zones.find((z) => z.attributes.TreatmentZoneCode === 1)!;
    const doNotTreat = zones.find((z) => z.attributes.TreatmentZoneCode === 0)!;
    // ISO 11783-11 data dictionary: DDI 289 (0x0121) "Setpoint Work State", 1 = on, 0 = off (the isoxml package's DDI table agrees).
    expect(treat.attributes.ProcessDataVariable?.map((v) => [v.attributes.ProcessDataDDI, v.attributes.ProcessDataValue])).toEqual([['0121', 1]]);
    expect(doNotTreat.attributes.ProcessDataVariable?.map((v) => [v.attributes.ProcessDataDDI, v.attributes.ProcessDataValue])).toEqual([['0121', 0]]);
    expect([task.attributes.DefaultTreatmentZoneCode, task.attributes.OutOfFieldTreatmentZoneCode, task.attributes.PositionLostTreatmentZoneCode]).toEqual([
      0, 0, 0,
    ]);
    const treated = isoxml.ExtendedPolygon.toGeoJSON(treat.attributes.PolygonTreatmentZoneonly ?? []) as unknown as MultiPolygon;
    const stored = await storedZones(zoneSet.id);
    const storedTotal = stored.reduce((s, z) => s + z.area_m2, 0);
    expect(Math.abs((await ellipsoidalArea(treated)) - storedTotal) / storedTotal).toBeLessThan(0.001);

    const zip = await JSZip.loadAsync(res.body as Buffer);
    const readme = await zip.file('TASKDATA/README.TXT')!.async('string');
    expect(readme).toMatch(/version 1/);
    expect(readme).toMatch(/no product and no rate/);
  });

  it('refuses a superseded version and a draft with a sentence, and another organisation finds nothing', async () => {
    const first = zoneSet;
    const second = await acceptHandDrawnZones();
    const superseded = await adviser.get(`/api/zone-sets/${first.id}/export.taskdata.zip`);
    expect(superseded.status).toBe(409);
    expect(superseded.body.error.message).toMatch(/replaced by a later version; export the accepted version/);
    expect((await adviser.get(`/api/zone-sets/${first.id}/export.shp.zip`)).status).toBe(409);
    await sequelize.query(`UPDATE zone_sets SET status = 'draft' WHERE id = :id`, { replacements: { id: second.id } });
    const draft = await adviser.get(`/api/zone-sets/${second.id}/export.shp.zip`);
    expect(draft.status).toBe(409);
    expect(draft.body.error.message).toMatch(/still a draft; accept it/);
    await sequelize.query(`UPDATE zone_sets SET status = 'accepted' WHERE id = :id`, { replacements: { id: second.id } });
    expect((await outsider.get(`/api/zone-sets/${second.id}/export.taskdata.zip`)).status).toBe(404);
    expect((await (await anonymous()).get(`/api/zone-sets/${second.id}/export.taskdata.zip`)).status).toBe(401);
    zoneSet = second;
  });
});

describe('zone files from a notice', () => {
  it('offers both files on the notice page and in the e-mail, fetched with the link token alone', async () => {
    const notice = (
      await adviser.post('/api/notices', { fieldId: scouted.field.id, zoneSetId: zoneSet.id, recommendation: 'Spot-treat both patches this week.' }).expect(201)
    ).body.notice;
    const [copy] = await sequelize.query<{ id: string }>(
      `INSERT INTO notice_recipients (notice_id, contact_name, email, status, attempts, message_id, smtp_accepted_at)
       VALUES (:noticeId, 'Ada Furrow', :email, 'sent', 1, :messageId, now()) RETURNING id`,
      {
        replacements: { noticeId: notice.id, email: `ada-${org.id.slice(0, 8)}@farm.example`, messageId: `<files-${notice.id}@test.example>` },
        type: QueryTypes.SELECT,
      },
    );
    const token = await issueNoticeToken(copy.id);
    const visitor = await anonymous();
    const page = (await visitor.get(`/api/notice-links/${token}`).expect(200)).body.notice;
    expect(page.zoneFiles).toEqual({ taskData: `/api/notice-links/${token}/zones.taskdata.zip`, shapefile: `/api/notice-links/${token}/zones.shp.zip` });
    for (const url of Object.values(page.zoneFiles as Record<string, string>)) {
      const res = await visitor.get(url);
      expect(res.status, url).toBe(200);
      expect(res.headers['content-type']).toBe('application/zip');
    }
    const mail = composeNoticeMail(await noticeMaterial(notice.id), `http://127.0.0.1/n/${token}`);
    expect(mail.text).toContain(`http://127.0.0.1/api/notice-links/${token}/zones.taskdata.zip`);
    expect(mail.html).toContain(`http://127.0.0.1/api/notice-links/${token}/zones.shp.zip`);
    expect(mail.text).toMatch(/not what to apply/);
  });
});
