// Which farms and fields a signed-in person may see. Every query in the services goes through these,
// so another organisation's ids (guessed or not) simply find nothing.
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db.ts';
import type { Actor } from '../auth/passport.ts';

const seesWholeOrganisation = (actor: Actor) => actor.role === 'admin' || actor.role === 'adviser';

/** Field ids the actor may read, or null meaning "every field of the organisation". */
export async function visibleFieldIds(actor: Actor): Promise<string[] | null> {
  if (seesWholeOrganisation(actor)) return null;
  const sql =
    actor.role === 'scout'
      ? `SELECT f.id FROM fields f JOIN field_assignments a ON a.field_id = f.id WHERE a.user_id = :userId AND f.organisation_id = :org`
      : `SELECT f.id FROM fields f JOIN farm_growers g ON g.farm_id = f.farm_id WHERE g.user_id = :userId AND f.organisation_id = :org`;
  const rows = await sequelize.query<{ id: string }>(sql, { replacements: { userId: actor.id, org: actor.organisationId }, type: QueryTypes.SELECT });
  return rows.map((r) => r.id);
}

/** Farm ids the actor may read, or null meaning "every farm of the organisation". */
export async function visibleFarmIds(actor: Actor): Promise<string[] | null> {
  if (seesWholeOrganisation(actor)) return null;
  const sql =
    actor.role === 'scout'
      ? `SELECT DISTINCT f.farm_id AS id FROM fields f JOIN field_assignments a ON a.field_id = f.id WHERE a.user_id = :userId AND f.organisation_id = :org`
      : `SELECT g.farm_id AS id FROM farm_growers g JOIN farms f ON f.id = g.farm_id WHERE g.user_id = :userId AND f.organisation_id = :org`;
  const rows = await sequelize.query<{ id: string }>(sql, { replacements: { userId: actor.id, org: actor.organisationId }, type: QueryTypes.SELECT });
  return rows.map((r) => r.id);
}

export async function canSeeField(actor: Actor, fieldId: string) {
  const visible = await visibleFieldIds(actor);
  return visible === null || visible.includes(fieldId);
}
