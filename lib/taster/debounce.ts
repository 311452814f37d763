/**
 * Holds the latest value per slot and commits it after a quiet spell, so dragging a slider
 * sends one answer rather than forty.
 */
export interface SlotDebouncer<T> {
  push(slot: string, value: T): void;
  /** Commits everything still held, now (on leaving a screen or the page). */
  flushAll(): void;
  cancelAll(): void;
  /** Forgets a held value, when a newer answer to the same slot goes out directly. */
  discard(slot: string): void;
}

export function createSlotDebouncer<T>(
  delayMs: number,
  commit: (value: T) => void,
  timers: { set: (run: () => void, ms: number) => unknown; clear: (t: unknown) => void } = {
    set: (run, ms) => globalThis.setTimeout(run, ms),
    clear: (t) => globalThis.clearTimeout(t as ReturnType<typeof setTimeout>),
  },
): SlotDebouncer<T> {
  const held = new Map<string, { value: T; timer: unknown }>();
  return {
    push(slot, value) {
      const prior = held.get(slot);
      if (prior) timers.clear(prior.timer);
      const timer = timers.set(() => {
        held.delete(slot);
        commit(value);
      }, delayMs);
      held.set(slot, { value, timer });
    },
    flushAll() {
      const entries = [...held.values()];
      held.clear();
      for (const e of entries) {
        timers.clear(e.timer);
        commit(e.value);
      }
    },
    discard(slot) {
      const prior = held.get(slot);
      if (prior) timers.clear(prior.timer);
      held.delete(slot);
    },
    cancelAll() {
      for (const e of held.values()) timers.clear(e.timer);
      held.clear();
    },
  };
}
