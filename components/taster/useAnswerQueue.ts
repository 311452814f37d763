'use client';

import { useCallback, useEffect, useMemo, useState, useSyncExternalStore } from 'react';
import { AnswerQueue, answerSlot, createSlotDebouncer, type AnswerPayload, type KeyValueStorage, type QueueStatus } from '@/lib/taster';

const SLIDER_QUIET_MS = 400;

function browserStorage(): KeyValueStorage | null {
  try {
    return typeof window === 'undefined' ? null : window.localStorage;
  } catch {
    return null;
  }
}

const SERVER_STATUS: QueueStatus = { phase: 'idle', waitingCount: 0, waitingSlots: [], hasStored: false, keptOnPhone: false, oldestAttempts: 0 };

/** One answer queue per seat, started once the page knows the session is open. */
export function useAnswerQueue(seatToken: string) {
  const [queue] = useState(() => new AnswerQueue({ seatToken, storage: browserStorage() }));
  const status = useSyncExternalStore(
    useCallback((listener: () => void) => queue.subscribe(listener), [queue]),
    () => queue.status(),
    () => SERVER_STATUS,
  );
  const debouncer = useMemo(() => createSlotDebouncer<AnswerPayload>(SLIDER_QUIET_MS, (a) => queue.enqueue(a)), [queue]);

  useEffect(() => {
    // Re-attaching after a remount (StrictMode does this in development) picks up where it was.
    if (queue.isStarted()) queue.resume();
    const resume = () => queue.resume();
    // Leaving the page must not lose a slider value still waiting out its debounce.
    const flush = () => debouncer.flushAll();
    window.addEventListener('online', resume);
    window.addEventListener('pagehide', flush);
    return () => {
      window.removeEventListener('online', resume);
      window.removeEventListener('pagehide', flush);
      debouncer.flushAll();
      queue.pause();
    };
  }, [queue, debouncer]);

  const give = useCallback(
    (answer: AnswerPayload, options: { debounce?: boolean } = {}) => {
      if (options.debounce) debouncer.push(answerSlot(answer), answer);
      else {
        debouncer.discard(answerSlot(answer));
        queue.enqueue(answer);
      }
    },
    [queue, debouncer],
  );

  return { queue, status, give, flushDebounced: debouncer.flushAll };
}
