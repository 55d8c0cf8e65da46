import { mailTransport } from '../mail/transport.ts';
import { config } from '../config.ts';
import { escapeHtml } from './escape-html.ts';
import { organisationHeader } from '../mail/organisation-header.ts';

/** The person a letter is for; their organisation files the letter in the development mailbox. */
export interface AccountHolder {
  name: string;
  email: string;
  organisationId: string;
}

export async function sendInvitation(to: AccountHolder, invitedBy: string, organisationName: string, token: string) {
  const link = `${config.publicUrl}/set-password?token=${encodeURIComponent(token)}`;
  await mailTransport().sendMail({
    to: { name: to.name, address: to.email },
    headers: organisationHeader(to.organisationId),
    subject: `You are invited to ${organisationName} on Patchwise`,
    text: `Hello ${to.name},\n\n${invitedBy} has invited you to ${organisationName} on Patchwise.\nChoose your password here (the link works once and expires in 72 hours):\n\n${link}\n`,
    html: `<p>Hello ${escapeHtml(to.name)},</p><p>${escapeHtml(invitedBy)} has invited you to ${escapeHtml(organisationName)} on Patchwise.</p><p><a href="${escapeHtml(link)}">Choose your password</a> (the link works once and expires in 72 hours).</p>`,
  });
}

export async function sendPasswordReset(to: AccountHolder, token: string) {
  const link = `${config.publicUrl}/set-password?token=${encodeURIComponent(token)}`;
  await mailTransport().sendMail({
    to: { name: to.name, address: to.email },
    headers: organisationHeader(to.organisationId),
    subject: 'Reset your Patchwise password',
    text: `Hello ${to.name},\n\nSomeone asked to reset the password of this Patchwise account. If it was you, choose a new password here (the link works once and expires in 1 hour):\n\n${link}\n\nIf it was not you, ignore this message; your password stays as it is.\n`,
    html: `<p>Hello ${escapeHtml(to.name)},</p><p>Someone asked to reset the password of this Patchwise account. If it was you, <a href="${escapeHtml(link)}">choose a new password</a> (the link works once and expires in 1 hour).</p><p>If it was not you, ignore this message; your password stays as it is.</p>`,
  });
}

/** To the owner of an address another organisation tried to invite: who asked, and how to join them. */
export async function sendInvitationDeclined(to: AccountHolder, invitedBy: string, organisationName: string) {
  await mailTransport().sendMail({
    to: { name: to.name, address: to.email },
    headers: organisationHeader(to.organisationId),
    subject: `${organisationName} tried to invite you to Patchwise`,
    text: `Hello ${to.name},\n\n${invitedBy} of ${organisationName} tried to invite this address to Patchwise. It already belongs to your Patchwise account, and an account belongs to one advisory business, so no second account was made and ${organisationName} was not told that this address is in use.\n\nTo work with ${organisationName} as well, give them another e-mail address of yours to invite. If you did not expect this, ignore this message.\n`,
    html: `<p>Hello ${escapeHtml(to.name)},</p><p>${escapeHtml(invitedBy)} of ${escapeHtml(organisationName)} tried to invite this address to Patchwise. It already belongs to your Patchwise account, and an account belongs to one advisory business, so no second account was made and ${escapeHtml(organisationName)} was not told that this address is in use.</p><p>To work with ${escapeHtml(organisationName)} as well, give them another e-mail address of yours to invite. If you did not expect this, ignore this message.</p>`,
  });
}
