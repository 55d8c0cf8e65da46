import type { z } from 'zod';
import { sequelize } from '../db.ts';
import * as users from '../queries/users.ts';
import { useUpTokens } from '../queries/user-tokens.ts';
import { findOrganisation } from '../queries/organisations.ts';
import { deleteOtherSessionsOfUser, deleteSessionsOfUser } from '../queries/session.ts';
import type { Actor } from '../auth/passport.ts';
import type { inviteUserSchema, updateUserSchema, UserView } from '../../shared/schemas/users.ts';
import { AppError, badRequest, conflict, notFound } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { consumeToken, issueToken } from './user-tokens.ts';
import { sendInvitation, sendInvitationDeclined, sendPasswordReset } from './account-mail.ts';
import { hashPassword } from '../auth/passwords.ts';
import { passwordWeakness } from '../auth/password-strength.ts';
import { logger } from '../logger.ts';

/** The shape every API answer uses: never the password hash. */
const toPublic = (user: users.UserRow): UserView => ({
  id: user.id,
  organisationId: user.organisationId,
  name: user.name,
  email: user.email,
  role: user.role,
  active: user.active,
  invited: user.passwordHash === null,
});

/** The signed-in person as the client sees them (null once the account is gone). */
export async function currentUser(actor: Actor) {
  const user = await users.findUser(actor.id);
  return user ? toPublic(user) : null;
}

export async function listUsers(actor: Actor) {
  return (await users.listUsersOfOrganisation(actor.organisationId)).map(toPublic);
}

async function findOwnUser(actor: Actor, id: string) {
  const user = await users.findUserInOrganisation(actor.organisationId, id);
  if (!user) throw notFound('That user');
  return user;
}

/**
 * Invites a person by e-mail. An address that is already one of the admin's own users is refused plainly (the
 * admin can see their own users anyway). An address that belongs to another organisation must not be revealed:
 * any refusal naming it ("already has an account", "cannot invite that address; ask for another") tells one
 * advisory business who works with another. So both other cases get the same answer, after the same work (one
 * letter sent and waited for): a new pending user with an invitation, or for an address taken elsewhere no account
 * and a letter to its owner saying who tried to invite them and how to join (with another address). What remains
 * observable is only that no pending user appears in the admin's list; hiding that too would need invitations
 * kept apart from accounts (accounts are one per address, since sign-in is by address alone).
 */
export async function inviteUser(actor: Actor, input: z.infer<typeof inviteUserSchema>): Promise<{ message: string }> {
  const existing = await users.findUserByEmail(input.email);
  const organisation = await findOrganisation(actor.organisationId);
  const organisationName = organisation?.name ?? 'your advisory business';
  if (existing && existing.organisationId === actor.organisationId) {
    throw conflict(`${input.email} is already one of your users; use "Send invitation again" on their row if they have not set a password yet.`);
  }
  const answer = { message: invitationAcceptedMessage(input.email) };
  if (existing) {
    await recordAudit(actor, 'invite-declined', 'user', null, { role: input.role });
    await sendInvitationDeclined(existing, actor.name, organisationName).catch((error) => {
      logger.error({ err: error }, 'declined-invitation mail failed');
      throw invitationMailFailed(input.email);
    });
    return answer;
  }
  const { user, token } = await sequelize.transaction(async (transaction) => {
    const user = await users.insertUser(
      { organisationId: actor.organisationId, name: input.name, email: input.email, role: input.role, passwordHash: null },
      { transaction },
    );
    const token = await issueToken(user.id, 'invite', transaction);
    await recordAudit(actor, 'invite', 'user', user.id, { email: input.email, role: input.role }, transaction);
    return { user, token };
  });
  await sendInvitation(user, actor.name, organisationName, token).catch(() => {
    throw invitationMailFailed(input.email);
  });
  return answer;
}

export const invitationAcceptedMessage = (email: string) => `An invitation is on its way to ${email}.`;

// One wording for both cases, so a mail failure does not tell them apart either.
const invitationMailFailed = (email: string) =>
  new AppError(
    502,
    'mail_failed',
    `The invitation e-mail to ${email} could not be sent; try again in a few minutes (if they appear in your list, use "Send invitation again" on their row).`,
  );

export async function resendInvitation(actor: Actor, id: string) {
  const user = await findOwnUser(actor, id);
  if (user.passwordHash) throw badRequest(`${user.name} has already set a password; they can use "Forgot password" instead.`);
  const organisation = await findOrganisation(actor.organisationId);
  const token = await issueToken(user.id, 'invite');
  await sendInvitation(user, actor.name, organisation?.name ?? 'your advisory business', token);
  return toPublic(user);
}

export async function updateUser(actor: Actor, id: string, input: z.infer<typeof updateUserSchema>) {
  const user = await findOwnUser(actor, id);
  if (user.id === actor.id && ((input.role !== undefined && input.role !== user.role) || input.active === false)) {
    throw badRequest('You cannot change your own role or deactivate yourself; ask another admin.');
  }
  const before = { name: user.name, role: user.role, active: user.active };
  const updated = await sequelize.transaction(async (transaction) => {
    const updated = await users.updateUser(user.id, input, { transaction });
    if (input.active === false) {
      // Signing the user out everywhere: their sessions are dropped with the deactivation.
      await deleteSessionsOfUser(user.id, { transaction });
    }
    await recordAudit(actor, 'update', 'user', user.id, { before, after: input }, transaction);
    return updated;
  });
  return toPublic(updated);
}

/**
 * Sets a password from an invitation or reset link; the link then stops working, and every session of the account
 * other than `keepSessionId` (the one that set it, if any) is signed out (OWASP ASVS 4.0.3 V3.3.3). A password
 * that is easy to guess is refused before the link is used up, so the person can try another.
 */
export async function setPasswordWithToken(token: string, password: string, keepSessionId = '') {
  const passwordHash = await hashPassword(password);
  return sequelize.transaction(async (transaction) => {
    const userId = await consumeToken(token, transaction);
    if (!userId) throw new AppError(400, 'link_expired', 'This link has expired or was already used; ask for a new one.');
    const user = await users.findUser(userId, { transaction });
    if (!user || !user.active) throw new AppError(400, 'link_expired', 'This link has expired or was already used; ask for a new one.');
    const weakness = passwordWeakness(password, [user.email, ...user.email.split(/[@.+_-]/), ...user.name.split(/\s+/)]);
    if (weakness) throw badRequest(weakness, { password: weakness });
    const updated = await users.updateUser(user.id, { passwordHash }, { transaction });
    // Any other invitation or reset link still out there dies with the old password (one-time links: OWASP ASVS 4.0.3 V2.5).
    await useUpTokens(user.id, null, { transaction });
    await deleteOtherSessionsOfUser(user.id, keepSessionId, { transaction });
    await recordAudit({ id: user.id, organisationId: user.organisationId }, 'set-password', 'user', user.id, {}, transaction);
    return toPublic(updated);
  });
}

/** Sends a reset link when the address is known and active; answers the same way either way. */
export async function requestPasswordReset(email: string) {
  const user = await users.findUserByEmail(email);
  if (!user || !user.active) return;
  const token = await issueToken(user.id, 'reset');
  await sendPasswordReset(user, token).catch((error) => logger.error({ err: error }, 'password reset mail failed'));
}
