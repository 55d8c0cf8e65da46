import crypto from 'node:crypto';
import type { Transaction } from 'sequelize';
import { consumeTokenByHash, insertToken, useUpTokens } from '../queries/user-tokens.ts';

export const INVITE_LIFETIME_MS = 72 * 60 * 60 * 1000;
export const RESET_LIFETIME_MS = 60 * 60 * 1000;

export const hashToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');

/** Issues a one-time token; only its hash is stored, so a database leak reveals no working link. */
export async function issueToken(userId: string, purpose: 'invite' | 'reset', transaction?: Transaction) {
  const token = crypto.randomBytes(32).toString('base64url');
  const lifetime = purpose === 'invite' ? INVITE_LIFETIME_MS : RESET_LIFETIME_MS;
  // A newer link replaces every older unused one of the same purpose.
  await useUpTokens(userId, purpose, { transaction });
  await insertToken({ userId, purpose, tokenHash: hashToken(token), expiresAt: new Date(Date.now() + lifetime) }, { transaction });
  return token;
}

/** Marks a token used and returns its user id, or null when it is unknown, used or expired. */
export async function consumeToken(token: string, transaction: Transaction) {
  return consumeTokenByHash(hashToken(token), { transaction });
}
