'use client';

import { useSyncExternalStore } from 'react';

const noSubscription = () => () => {};

/**
 * False in the server's HTML and while the page hydrates, true once this script has taken the page
 * over (and on every render after). For what must not be live before then (a control whose tap
 * nobody would record), or what only the browser draws (a live panel below the fold).
 */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    noSubscription,
    () => true,
    () => false,
  );
}
