/** Reads the local SMTP fake's web view, so an admin can see sent mail in development. */
import { env } from '@/lib/env';

export interface OutboxMessage {
  id: string;
  to: string[];
  subject: string;
  text: string;
  date: string;
}

export async function readOutbox(): Promise<{ available: boolean; messages: OutboxMessage[] }> {
  const url = env().MAIL_OUTBOX_URL;
  if (!url) return { available: false, messages: [] };
  try {
    const res = await fetch(`${url}/messages`, { cache: 'no-store', signal: AbortSignal.timeout(3000) });
    if (!res.ok) return { available: false, messages: [] };
    return { available: true, messages: (await res.json()) as OutboxMessage[] };
  } catch {
    return { available: false, messages: [] };
  }
}
