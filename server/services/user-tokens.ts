import crypto from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { UserToken } from '../models/user-token.ts';

export const INVITE_LIFETIME_MS = 72 * 60 * 60 * 1000;
export const RESET_LIFETIME_MS = 60 * 60 * 1000;

export const hashToken = (token: string) => crypto.createHash('sha256').update(token).digest('hex');

/** Issues a one-time token; only its hash is stored, so a database leak reveals no working link. */
export async function issueToken(userId: string, purpose: 'invite' | 'reset', transaction?: Transaction) {
  const token = crypto.randomBytes(32).toString('base64url');
  const lifetime = purpose === 'invite' ? INVITE_LIFETIME_MS : RESET_LIFETIME_MS;
  // A newer link replaces every older unused one of the same purpose.
  await UserToken.update({ usedAt: new Date() }, { where: { userId, purpose, usedAt: null }, transaction });
  await UserToken.create({ userId, purpose, tokenHash: hashToken(token), expiresAt: new Date(Date.now() + lifetime), usedAt: null }, { transaction });
  return token;
}

/** Marks a token used and returns its user id, or null when it is unknown, used or expired. */
export async function consumeToken(token: string, transaction: Transaction) {
  const row = await UserToken.findOne({
    where: { tokenHash: hashToken(token), usedAt: null, expiresAt: { [Op.gt]: new Date() } },
    transaction,
    lock: transaction.LOCK.UPDATE,
  });
  if (!row) return null;
  row.usedAt = new Date();
  await row.save({ transaction });
  return row.userId;
}
