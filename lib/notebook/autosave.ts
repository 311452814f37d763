/** The autosave indicator's states and timings, kept apart from React so they can be reasoned about alone. */
import { backoffDelayMs } from '@/lib/backoff';

/** Quiet time after the last keystroke before a save starts, in milliseconds. */
export const AUTOSAVE_DELAY_MS = 1500;
/** First retry after a network failure, in milliseconds; doubles each time up to the cap. */
export const RETRY_BASE_MS = 2000;
export const RETRY_MAX_MS = 30_000;

export type SaveState =
  | { kind: 'idle'; savedAt: string | null }
  | { kind: 'saved'; savedAt: string }
  | { kind: 'dirty' }
  | { kind: 'saving' }
  | { kind: 'offline'; attempt: number }
  | { kind: 'error'; message: string }
  | { kind: 'conflict' };

/** Delay before retry number `attempt` (1-based, as the phone's outbox counts) after a network failure. */
export function retryDelayMs(attempt: number): number {
  return backoffDelayMs(attempt, { firstMs: RETRY_BASE_MS, maxMs: RETRY_MAX_MS });
}

/** "14:02" in the reader's local time. */
export function clockTime(iso: string): string {
  const d = new Date(iso);
  return `${String(d.getHours()).padStart(2, '0')}:${String(d.getMinutes()).padStart(2, '0')}`;
}

export function saveStateLabel(state: SaveState): string {
  switch (state.kind) {
    case 'idle':
      return state.savedAt ? `Saved at ${clockTime(state.savedAt)}` : 'No changes yet';
    case 'saved':
      return `Saved at ${clockTime(state.savedAt)}`;
    case 'dirty':
      return 'Unsaved changes';
    case 'saving':
      return 'Saving…';
    case 'offline':
      return 'Offline — will retry';
    case 'error':
      return `Not saved: ${state.message}`;
    case 'conflict':
      return 'Kept beside a newer version — choose below';
  }
}

/** States in which leaving the page would lose typing. */
export function hasUnsavedWork(state: SaveState): boolean {
  return state.kind === 'dirty' || state.kind === 'saving' || state.kind === 'offline' || state.kind === 'error';
}

/**
 * Turns what the user typed into a link address, or explains why it cannot be one.
 * A bare domain ("example.org/page") gets https:// in front.
 */
export function normaliseLinkInput(raw: string, isAllowed: (href: string) => boolean): { ok: true; href: string } | { ok: false; message: string } {
  const text = raw.trim();
  if (!text) return { ok: false, message: 'Enter an address.' };
  const looksLikeDomain = /^[a-z0-9-]+(\.[a-z0-9-]+)+([/?#].*)?$/i.test(text);
  const href = looksLikeDomain ? `https://${text}` : text;
  if (!isAllowed(href)) return { ok: false, message: 'Use an address starting with https://, http://, mailto: or / (a page of this app).' };
  return { ok: true, href };
}
