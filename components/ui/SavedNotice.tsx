'use client';

import { useEffect, useState } from 'react';

/**
 * "Saved …" on the page a form returns to. The live region is in the page first and its words arrive
 * after, so screen readers announce them (a region that arrives already holding its text is often not read).
 */
export function SavedNotice({ text }: { text: string }) {
  const [shown, setShown] = useState('');
  useEffect(() => {
    // A moment after the empty region is in the page, so assistive technology has registered it.
    const t = setTimeout(() => setShown(text), 100);
    return () => clearTimeout(t);
  }, [text]);
  return (
    <div role="status" aria-live="polite" className={shown ? 'mb-4 rounded-lg bg-leaf-50 px-4 py-3 text-sm font-semibold text-leaf-700 ring-1 ring-inset ring-leaf-100' : ''}>
      {shown}
    </div>
  );
}
