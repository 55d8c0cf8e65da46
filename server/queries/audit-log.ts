import { execute, type InTransaction } from './sql.ts';

export interface NewAuditEntry {
  organisationId: string | null;
  userId: string | null;
  action: string;
  entity: string;
  entityId: string | null;
  changes: Record<string, unknown>;
}

export const insertAuditEntry = (entry: NewAuditEntry, options: InTransaction = {}) =>
  execute(
    'INSERT INTO audit_log (organisation_id, user_id, action, entity, entity_id, changes) VALUES (:organisationId, :userId, :action, :entity, :entityId, :changes)',
    { ...entry, changes: JSON.stringify(entry.changes) },
    options,
  );
