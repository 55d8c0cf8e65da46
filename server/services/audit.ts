import type { Transaction } from 'sequelize';
import { insertAuditEntry } from '../queries/audit-log.ts';
import type { Actor } from '../auth/passport.ts';

/** Writes who changed what; inside the caller's transaction so the log never disagrees with the data. */
export async function recordAudit(
  who: Pick<Actor, 'id' | 'organisationId'> | null,
  action: string,
  entity: string,
  entityId: string | null,
  changes: Record<string, unknown> = {},
  transaction?: Transaction,
) {
  await insertAuditEntry({ organisationId: who?.organisationId ?? null, userId: who?.id ?? null, action, entity, entityId, changes }, { transaction });
}
