import { sequelize } from '../db.ts';
import * as pests from '../queries/pests.ts';
import type { Actor } from '../auth/passport.ts';
import type { PestInput, PestView } from '../../shared/schemas/pests.ts';
import { badRequest, notFound } from '../errors.ts';
import { recordAudit } from './audit.ts';

const present = (p: pests.PestRow): PestView => ({
  id: p.id,
  name: p.name,
  kind: p.kind,
  countUnit: p.countUnit,
  actionThreshold: p.actionThreshold,
  thresholdBasis: p.thresholdBasis,
  thresholdNote: p.thresholdNote,
  thresholdSource: p.thresholdSource,
  active: p.active,
  rescoutDays: p.rescoutDays,
  rescoutSource: p.rescoutSource,
  rescoutConfirmed: p.rescoutConfirmed,
  crops: p.crops,
  thresholdConfirmed: p.thresholdConfirmed,
});

/** The details a threshold's confirmation vouches for: changing any of them leaves it to be confirmed again. */
const confirmedDetails = ['actionThreshold', 'thresholdBasis', 'countUnit', 'thresholdSource'] as const;
const changesThreshold = (pest: pests.PestRow, input: Partial<PestInput>) =>
  confirmedDetails.some((key) => input[key] !== undefined && input[key] !== pest[key]);

export async function listPests(actor: Actor, options: { includeInactive?: boolean } = {}) {
  return (await pests.listPestsOfOrganisation(actor.organisationId, options.includeInactive ?? false)).map(present);
}

export async function findPest(actor: Actor, id: string) {
  const pest = await pests.findPestInOrganisation(actor.organisationId, id);
  if (!pest) throw notFound('That pest');
  return pest;
}

export async function createPest(actor: Actor, input: PestInput) {
  return sequelize.transaction(async (transaction) => {
    const pest = await pests.insertPest({ ...input, organisationId: actor.organisationId }, { transaction });
    await recordAudit(actor, 'create', 'pest', pest.id, input, transaction);
    return present(pest);
  });
}

export async function updatePest(actor: Actor, id: string, input: Partial<PestInput>) {
  const pest = await findPest(actor, id);
  const thresholdChanged = changesThreshold(pest, input);
  // A confirmation is of the stored value and source: a new value is saved first and confirmed after.
  if (thresholdChanged && input.thresholdConfirmed === true)
    throw badRequest('Save the new threshold first, then confirm it against its source.', {
      thresholdConfirmed: 'Save the new threshold first, then confirm it against its source.',
    });
  const changes = thresholdChanged ? { ...input, thresholdConfirmed: false } : input;
  return sequelize.transaction(async (transaction) => {
    const before = present(pest);
    const updated = await pests.updatePest(id, changes, { transaction });
    await recordAudit(actor, 'update', 'pest', id, { before, after: input }, transaction);
    return present(updated);
  });
}
