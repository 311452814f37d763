import 'server-only';
/**
 * The mail outbox page's data: what the local SMTP fake received for the current workspace.
 *
 * - The page exists only with the local fake (MAIL_OUTBOX_URL set and SMTP_URL on this machine);
 *   with a real relay it is a 404.
 * - A workspace sees only mail its own actions sent (the fake keeps the X-Setwell-Workspace
 *   header); mail of no workspace (password resets) is never shown, nor is mail without the header.
 * - Links and anything shaped like a token are replaced: a link is for its recipient alone.
 */
import { env, type Env } from '@/lib/env';
import type { Actor } from '@/lib/permissions';

export interface OutboxMessage {
  id: string;
  to: string[];
  subject: string;
  text: string;
  date: string;
}

interface FakeMessage extends OutboxMessage {
  workspaceId?: string | null;
}

export const LINK_HIDDEN = '[link hidden: only the recipient gets it]';
const LOOPBACK_HOSTS = new Set(['127.0.0.1', 'localhost', '[::1]', '::1']);

/** True when mail goes to the local fake, whose messages the outbox page may read. */
export function outboxAvailable({ MAIL_OUTBOX_URL, SMTP_URL }: Pick<Env, 'MAIL_OUTBOX_URL' | 'SMTP_URL'> = env()): boolean {
  if (!MAIL_OUTBOX_URL) return false;
  try {
    return LOOPBACK_HOSTS.has(new URL(SMTP_URL).hostname);
  } catch {
    return false;
  }
}

/** Every URL, and every run of URL-safe characters long enough to be a secret, becomes LINK_HIDDEN. */
export function redactLinks(text: string): string {
  return text.replace(/\b(?:https?|mailto):\S+/gi, LINK_HIDDEN).replace(/[A-Za-z0-9_-]{32,}/g, LINK_HIDDEN);
}

export async function readWorkspaceOutbox(actor: Actor): Promise<{ reachable: boolean; messages: OutboxMessage[] }> {
  if (!outboxAvailable()) return { reachable: false, messages: [] };
  try {
    const res = await fetch(`${env().MAIL_OUTBOX_URL}/messages`, { cache: 'no-store', signal: AbortSignal.timeout(3000) });
    if (!res.ok) return { reachable: false, messages: [] };
    const all = (await res.json()) as FakeMessage[];
    const messages = all
      .filter((m) => m.workspaceId === actor.workspaceId)
      .map((m) => ({ id: m.id, to: m.to, subject: redactLinks(m.subject), text: redactLinks(m.text), date: m.date }));
    return { reachable: true, messages };
  } catch {
    return { reachable: false, messages: [] };
  }
}
