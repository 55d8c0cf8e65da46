// The session store's table (connect-pg-simple): signing an account out means dropping its rows.
import { execute, type InTransaction } from './sql.ts';

export const deleteSessionsOfUser = (userId: string, options: InTransaction = {}) =>
  execute(`DELETE FROM session WHERE sess->'passport'->>'user' = :id`, { id: userId }, options);

export const deleteOtherSessionsOfUser = (userId: string, keepSessionId: string, options: InTransaction = {}) =>
  execute(`DELETE FROM session WHERE sess->'passport'->>'user' = :id AND sid <> :keep`, { id: userId, keep: keepSessionId }, options);
