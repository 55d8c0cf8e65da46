import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '../config.ts';

let transporter: Transporter | null = null;

/** The one SMTP transport: the local mail catcher by default, a real server when SMTP_URL says so. */
export function mailTransport(): Transporter {
  transporter ??= nodemailer.createTransport(config.smtpUrl, { from: config.mailFrom });
  return transporter;
}

export function resetMailTransport() {
  transporter?.close();
  transporter = null;
}
