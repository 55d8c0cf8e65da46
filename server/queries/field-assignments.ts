import { execute, selectRows, type InTransaction } from './sql.ts';

export interface FieldAssignmentRow {
  fieldId: string;
  userId: string;
}

export const listAssignmentsOfFields = (fieldIds: string[], options: InTransaction = {}) =>
  fieldIds.length
    ? selectRows<FieldAssignmentRow>(
        'SELECT field_id AS "fieldId", user_id AS "userId" FROM field_assignments WHERE field_id IN (:fieldIds)',
        { fieldIds },
        options,
      )
    : Promise.resolve([]);

/** Assigns a scout to a field; assigning twice changes nothing. */
export const insertFieldAssignment = (fieldId: string, userId: string, options: InTransaction = {}) =>
  execute('INSERT INTO field_assignments (field_id, user_id) VALUES (:fieldId, :userId) ON CONFLICT DO NOTHING', { fieldId, userId }, options);

export const deleteFieldAssignment = (fieldId: string, userId: string, options: InTransaction = {}) =>
  execute('DELETE FROM field_assignments WHERE field_id = :fieldId AND user_id = :userId', { fieldId, userId }, options);
