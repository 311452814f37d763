'use client';

import { useEffect, useRef, useState, type ReactNode } from 'react';

/**
 * A `<details>` whose contents are drawn when it is first opened. Closed, a `<details>` neither shows
 * nor prints its contents, so drawing them up front only cost the server's render and the page's HTML
 * (the formula editor's rules that do not apply, the results' ANOVA tables). Once opened they stay.
 */
export function Disclosure({ summary, className, summaryClassName, children }: { summary: ReactNode; className?: string; summaryClassName?: string; children: ReactNode }) {
  const ref = useRef<HTMLDetailsElement>(null);
  const [opened, setOpened] = useState(false);
  // Opened before the script ran (a quick click on the summary): draw the contents now.
  useEffect(() => {
    if (ref.current?.open) setOpened(true);
  }, []);
  return (
    <details ref={ref} className={className} onToggle={(e) => { if (e.currentTarget.open) setOpened(true); }}>
      <summary className={summaryClassName}>{summary}</summary>
      {opened ? children : null}
    </details>
  );
}
