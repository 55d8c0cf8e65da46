// Writing a zone notice: the draft the adviser composes for one accepted zone set.
import type { Actor } from '../auth/passport.ts';
import { sequelize } from '../db.ts';
import { insertNotice } from '../queries/notices.ts';
import { findZoneSetRefInOrganisation } from '../queries/zone-sets.ts';
import { findCheckInOrganisation } from '../queries/pattern-checks.ts';
import { badRequest } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { findVisibleField } from './fields.ts';
import { getNotice } from './notice-reading.ts';
import type { NoticeCreateRequest } from '../../shared/schemas/notices.ts';

export async function createNotice(actor: Actor, input: NoticeCreateRequest) {
  await findVisibleField(actor, input.fieldId);
  const zoneSet = await findZoneSetRefInOrganisation(actor.organisationId, input.zoneSetId);
  if (!zoneSet || zoneSet.fieldId !== input.fieldId)
    throw badRequest('Choose zones accepted for this field.', { zoneSetId: 'Those zones are not for this field.' });
  if (zoneSet.status !== 'accepted')
    throw badRequest(`Zones version ${zoneSet.version} has been replaced by a newer version; write the notice for the current zones.`, {
      zoneSetId: 'Those zones have been superseded.',
    });
  const checkId = input.checkId ?? zoneSet.checkId;
  if (checkId) {
    const check = await findCheckInOrganisation(actor.organisationId, checkId);
    if (!check || check.fieldId !== input.fieldId || check.pestId !== zoneSet.pestId)
      throw badRequest('That check is for another field or pest.', { checkId: 'That check is for another field or pest.' });
  }
  const notice = await sequelize.transaction(async (transaction) => {
    const created = await insertNotice(
      {
        organisationId: actor.organisationId,
        fieldId: input.fieldId,
        zoneSetId: zoneSet.id,
        checkId: checkId ?? null,
        pestId: zoneSet.pestId,
        recommendation: input.recommendation,
        rescoutOn: input.rescoutOn ?? null,
        createdBy: actor.id,
      },
      { transaction },
    );
    await recordAudit(actor, 'create', 'notice', created, { fieldId: input.fieldId, zoneSetId: zoneSet.id }, transaction);
    return created;
  });
  return getNotice(actor, notice);
}
