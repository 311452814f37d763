'use client';

import { useEffect, useState } from 'react';

/**
 * "Saved …" on the page a form returns to. The live region is in the page first and its words arrive
 * after, so screen readers announce them (a region that arrives already holding its text is often not read).
 * The query parameter that asked for it (`param`, default `saved`) then leaves the address, so a reload
 * or a bookmark does not announce the save again.
 */
export function SavedNotice({ text, param = 'saved' }: { text: string; param?: string }) {
  const [shown, setShown] = useState('');
  useEffect(() => {
    // A moment after the empty region is in the page, so assistive technology has registered it.
    const t = setTimeout(() => {
      setShown(text);
      const url = new URL(window.location.href);
      if (url.searchParams.has(param)) {
        url.searchParams.delete(param);
        window.history.replaceState(window.history.state, '', url);
      }
    }, 100);
    return () => clearTimeout(t);
  }, [text, param]);
  return (
    <div role="status" aria-live="polite" className={shown ? 'mb-4 rounded-lg bg-leaf-50 px-4 py-3 text-sm font-semibold text-leaf-700 ring-1 ring-inset ring-leaf-100' : ''}>
      {shown}
    </div>
  );
}
