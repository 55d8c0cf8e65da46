import { mailTransport } from '../mail/transport.ts';
import { config } from '../config.ts';
import { escapeHtml } from './escape-html.ts';

export async function sendInvitation(to: { name: string; email: string }, invitedBy: string, organisationName: string, token: string) {
  const link = `${config.publicUrl}/set-password?token=${encodeURIComponent(token)}`;
  await mailTransport().sendMail({
    to: { name: to.name, address: to.email },
    subject: `You are invited to ${organisationName} on Patchwise`,
    text: `Hello ${to.name},\n\n${invitedBy} has invited you to ${organisationName} on Patchwise.\nChoose your password here (the link works once and expires in 72 hours):\n\n${link}\n`,
    html: `<p>Hello ${escapeHtml(to.name)},</p><p>${escapeHtml(invitedBy)} has invited you to ${escapeHtml(organisationName)} on Patchwise.</p><p><a href="${escapeHtml(link)}">Choose your password</a> (the link works once and expires in 72 hours).</p>`,
  });
}

export async function sendPasswordReset(to: { name: string; email: string }, token: string) {
  const link = `${config.publicUrl}/set-password?token=${encodeURIComponent(token)}`;
  await mailTransport().sendMail({
    to: { name: to.name, address: to.email },
    subject: 'Reset your Patchwise password',
    text: `Hello ${to.name},\n\nSomeone asked to reset the password of this Patchwise account. If it was you, choose a new password here (the link works once and expires in 1 hour):\n\n${link}\n\nIf it was not you, ignore this message; your password stays as it is.\n`,
    html: `<p>Hello ${escapeHtml(to.name)},</p><p>Someone asked to reset the password of this Patchwise account. If it was you, <a href="${escapeHtml(link)}">choose a new password</a> (the link works once and expires in 1 hour).</p><p>If it was not you, ignore this message; your password stays as it is.</p>`,
  });
}
