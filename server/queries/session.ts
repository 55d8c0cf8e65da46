// The session store's table (connect-pg-simple): signing an account out means dropping its rows.
import type pg from 'pg';
import { execute, type InTransaction } from './sql.ts';

export const deleteSessionsOfUser = (userId: string, options: InTransaction = {}) =>
  execute(`DELETE FROM session WHERE sess->'passport'->>'user' = :id`, { id: userId }, options);

export const deleteOtherSessionsOfUser = (userId: string, keepSessionId: string, options: InTransaction = {}) =>
  execute(`DELETE FROM session WHERE sess->'passport'->>'user' = :id AND sid <> :keep`, { id: userId, keep: keepSessionId }, options);

export interface SessionWithActorRow {
  sess: Record<string, unknown>;
  /** The session's signed-in user, when there is one and the account is active. */
  actor: { id: string; organisationId: string; role: string; name: string; email: string; dateFormat: { locale: string; timeZone: string } } | null;
}

/**
 * A live session and its signed-in, active user (with the organisation's date format, which every page asks for) in one read (the two reads every signed-in request makes), straight
 * on the pg pool. A session that names a missing or deactivated user comes back with `actor: null`.
 */
export async function findLiveSessionWithActor(pool: pg.Pool, sid: string): Promise<SessionWithActorRow | null> {
  // A named statement: PostgreSQL parses and plans it once per connection, not on every request.
  const { rows } = await pool.query<SessionWithActorRow>({
    name: 'live-session-with-actor',
    text: `SELECT s.sess,
            CASE WHEN u.id IS NULL THEN NULL
                 ELSE json_build_object('id', u.id, 'organisationId', u.organisation_id, 'role', u.role, 'name', u.name, 'email', u.email,
                                        'dateFormat', json_build_object('locale', o.locale, 'timeZone', o.time_zone)) END AS actor
       FROM session s
       LEFT JOIN users u
              ON u.id = CASE WHEN s.sess->'passport'->>'user' ~ '^[0-9a-f-]{36}$' THEN (s.sess->'passport'->>'user')::uuid END
             AND u.active
       LEFT JOIN organisations o ON o.id = u.organisation_id
      WHERE s.sid = $1 AND s.expire >= now()`,
    values: [sid],
  });
  return rows[0] ?? null;
}
