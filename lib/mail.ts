/** Outgoing e-mail over SMTP (nodemailer). Development and tests point SMTP_URL at the local fake. */
import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '@/lib/env';

export interface OutgoingMail {
  to: string;
  subject: string;
  /** Every message has a plain-text part; html is optional. */
  text: string;
  html?: string;
}

const cache = globalThis as unknown as { setwellMailer?: Transporter };

function transport(): Transporter {
  cache.setwellMailer ??= nodemailer.createTransport(env().SMTP_URL);
  return cache.setwellMailer;
}

export async function sendMail(mail: OutgoingMail): Promise<void> {
  await transport().sendMail({ from: env().MAIL_FROM, ...mail });
}

/** Escapes text for the small HTML parts of our e-mails. */
export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}
