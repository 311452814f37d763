import 'server-only';
/** Outgoing e-mail over SMTP (nodemailer). Development and tests point SMTP_URL at the local fake. */
import nodemailer, { type Transporter } from 'nodemailer';
import { env } from '@/lib/env';

/** Names the workspace whose action sent a message; the local fake keeps it so each outbox shows only its own. */
export const WORKSPACE_MAIL_HEADER = 'X-Setwell-Workspace';

export interface OutgoingMail {
  /**
   * The workspace whose action sent it, or null for mail that belongs to no workspace (password
   * resets). Every sender says which, so no message lands in the wrong outbox by default.
   */
  workspaceId: string | null;
  to: string;
  subject: string;
  /** Every message has a plain-text part; html is optional. */
  text: string;
  html?: string;
}

/** Typed in lib/process-cache.ts. */
const cache = globalThis;

function transport(): Transporter {
  cache.setwellMailer ??= nodemailer.createTransport(env().SMTP_URL);
  return cache.setwellMailer;
}

export async function sendMail({ workspaceId, ...mail }: OutgoingMail): Promise<void> {
  await transport().sendMail({ from: env().MAIL_FROM, ...mail, headers: workspaceId ? { [WORKSPACE_MAIL_HEADER]: workspaceId } : {} });
}

/** Escapes text for the small HTML parts of our e-mails. */
export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}
