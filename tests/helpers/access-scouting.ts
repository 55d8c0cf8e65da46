// The scouting half of the access world: a walk with a photo sighting, a finished pattern check with accepted
// zones, a sent notice with tokenised copies, and makers for records a request may use up (a sighting to delete).
import crypto from 'node:crypto';
import { centroid } from '@turf/turf';
import { sequelize } from '../../server/db.ts';
import { issueNoticeToken } from '../../server/services/notice-links.ts';
import { makeThumbnail } from '../../server/services/thumbnails.ts';
import { buildAccessWorld, type AccessWorld } from './access-matrix.ts';
import { plainField } from './boundary-shapes.ts';
import { makeJpeg, uploadPhotos } from './photos.ts';
import { anonymous } from './http.ts';
import { acceptProposedZones, addContacts, linkGrower, makeCheckedField } from './zones.ts';

export interface ScoutingIds {
  walk: string;
  sighting: string;
  photo: string;
  checkedField: string;
  checkedPest: string;
  check: string;
  zoneSet: string;
  notice: string;
  recipient: string;
  spareRecipient: string;
  noticeToken: string;
  spareField: string;
  sparePest: string;
  spareCheck: string;
}

export interface ScoutingWorld extends AccessWorld {
  scouting: ScoutingIds;
  /** Zones proposed from the spare check, for the zone-set row's body. */
  spareZones: object;
  /** A point inside assignedField (the walk's field). */
  insideAssigned: { lon: number; lat: number };
}

const [centreLon, centreLat] = centroid(plainField(0)).geometry.coordinates;

async function addSentCopy(noticeId: string, name: string, email: string) {
  const id = crypto.randomUUID();
  await sequelize.query(
    `INSERT INTO notice_recipients (id, notice_id, contact_name, email, status, attempts, message_id, smtp_accepted_at)
     VALUES (:id, :noticeId, :name, :email, 'sent', 1, :messageId, now())`,
    { replacements: { id, noticeId, name, email, messageId: `<matrix-${id}@test.example>` } },
  );
  return id;
}

export async function buildScoutingWorld(): Promise<ScoutingWorld> {
  const world = await buildAccessWorld();
  const { clients, home, ids } = world;
  const insideAssigned = { lon: centreLon, lat: centreLat };

  const walk = (await clients.scout.post('/api/walks', { fieldId: ids.assignedField, walkedOn: '2026-07-01' }).expect(201)).body.walk.id as string;
  const upload = await uploadPhotos(clients.scout, [{ bytes: await makeJpeg(), name: 'leaf.jpg' }], { pestId: ids.pest, walkId: walk }).expect(200);
  const [photoResult] = upload.body.results;
  if (photoResult.outcome !== 'needs-pin') throw new Error(`photo not kept: ${JSON.stringify(photoResult)}`);
  await makeThumbnail(photoResult.photoId);

  // The checked field's farm is linked to the grower (who may see its zones); the scout is not assigned to it.
  const checked = await makeCheckedField(home, clients.adviser, { seed: 21 });
  await linkGrower(checked.field.farmId, home.users.grower.id);
  await addContacts(checked.field.farmId, [{ name: 'Matrix Contact', email: `matrix-${home.id.slice(0, 8)}@farm.example` }]);
  const zoneSet = await acceptProposedZones(clients.adviser, checked);
  const recommendation = 'Spot-spray the two zones within five days; re-scout the rest next week.';
  const notice = (await clients.adviser.post('/api/notices', { fieldId: checked.field.id, zoneSetId: zoneSet.id, recommendation }).expect(201)).body.notice
    .id as string;
  const recipient = await addSentCopy(notice, 'Matrix Grower', `copy-${home.id.slice(0, 8)}@farm.example`);
  const spareRecipient = await addSentCopy(notice, 'Spare Grower', `spare-${home.id.slice(0, 8)}@farm.example`);
  await sequelize.query(`UPDATE notices SET status = 'sent', sent_at = now() WHERE id = :notice`, { replacements: { notice } });
  const noticeToken = await issueNoticeToken(recipient);

  // A second checked field for accepting a new zone set, so the notice's zones stay the current version.
  const spare = await makeCheckedField(home, clients.adviser, { seed: 22 });
  const proposal = await clients.adviser.post(`/api/checks/${spare.checkId}/zone-proposal`, { source: 'density' }).expect(200);

  const scoutStop = async () =>
    (await clients.scout.post(`/api/walks/${walk}/stops`, { pestId: ids.pest, ...insideAssigned, accuracyM: 5 }).expect(201)).body.sighting.id as string;
  world.makers.newStop = scoutStop;
  world.makers.newDeletedStop = async () => {
    const id = await scoutStop();
    await clients.scout.delete(`/api/sightings/${id}`).expect(204);
    return id;
  };
  // A fresh unanswered grower question per caller, asked through the copy's link (a question is answered once).
  world.makers.newQuestion = async () =>
    (await (await anonymous()).post(`/api/notice-links/${noticeToken}/questions`, { text: 'Does the margin by the ditch need a wider buffer?' }).expect(201))
      .body.question.id as string;
  world.makers.newDraftNotice = async () =>
    (await clients.adviser.post('/api/notices', { fieldId: checked.field.id, zoneSetId: zoneSet.id, recommendation }).expect(201)).body.notice.id as string;

  const scouting: ScoutingIds = {
    walk,
    sighting: photoResult.sightingId,
    photo: photoResult.photoId,
    checkedField: checked.field.id,
    checkedPest: checked.pest.id,
    check: checked.checkId,
    zoneSet: zoneSet.id,
    notice,
    recipient,
    spareRecipient,
    noticeToken,
    spareField: spare.field.id,
    sparePest: spare.pest.id,
    spareCheck: spare.checkId,
  };
  Object.assign(world.ids, scouting);
  return { ...world, scouting, spareZones: proposal.body.zones, insideAssigned };
}
