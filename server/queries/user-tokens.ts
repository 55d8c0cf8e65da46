import { execute, selectRow, type InTransaction } from './sql.ts';

export type TokenPurpose = 'invite' | 'reset';

/** Marks every unused token of the user as used (of one purpose, or all). */
export const useUpTokens = (userId: string, purpose: TokenPurpose | null, options: InTransaction = {}) =>
  execute(
    `UPDATE user_tokens SET used_at = now(), updated_at = now() WHERE user_id = :userId AND used_at IS NULL${purpose ? ' AND purpose = :purpose' : ''}`,
    { userId, purpose },
    options,
  );

export const insertToken = (token: { userId: string; purpose: TokenPurpose; tokenHash: string; expiresAt: Date }, options: InTransaction = {}) =>
  execute('INSERT INTO user_tokens (user_id, purpose, token_hash, expires_at) VALUES (:userId, :purpose, :tokenHash, :expiresAt)', token, options);

/** Marks the unused, unexpired token with this hash used (the row locked until the transaction ends) and returns its user id. */
export const consumeTokenByHash = async (tokenHash: string, options: InTransaction = {}) =>
  (
    await selectRow<{ userId: string }>(
      `UPDATE user_tokens SET used_at = now(), updated_at = now()
        WHERE id = (SELECT id FROM user_tokens WHERE token_hash = :tokenHash AND used_at IS NULL AND expires_at > now() LIMIT 1 FOR UPDATE)
        RETURNING user_id AS "userId"`,
      { tokenHash },
      options,
    )
  )?.userId ?? null;
