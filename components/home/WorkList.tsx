import Link from 'next/link';
import type { ReactNode } from 'react';

export interface WorkItem {
  key: string;
  href: string;
  label: string;
  detail?: ReactNode;
}

function WorkLinks({ items, className, label }: { items: WorkItem[]; className: string; label?: string }) {
  return (
    <ul className={className} aria-label={label}>
      {items.map((i) => (
        <li key={i.key} className="py-2">
          <Link href={i.href} className="font-medium text-damson-800 underline">{i.label}</Link>
          {i.detail ? <p className="text-sm text-rind-600">{i.detail}</p> : null}
        </li>
      ))}
    </ul>
  );
}

/**
 * One part of a home page's worklist: what waits, each item linking to where it is done; words when
 * nothing waits. `actions` are where new work starts ("Record a batch of …"): listed after the items
 * and not counted with them.
 */
export function WorkList({ title, items, empty, more, actions = [] }: { title: string; items: WorkItem[]; empty: string; more?: { href: string; label: string }; actions?: WorkItem[] }) {
  return (
    <section aria-label={title} className="min-w-0 break-words rounded-card bg-pith-50 p-5 shadow-card ring-1 ring-pith-300">
      <header className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-lg font-semibold">{title}{items.length ? <span className="ml-2 text-sm font-normal text-rind-500">{items.length}</span> : null}</h2>
        {more ? <Link href={more.href} className="text-sm text-damson-700 underline">{more.label}</Link> : null}
      </header>
      {items.length ? <WorkLinks items={items} className="divide-y divide-pith-200" /> : <p className="text-sm text-rind-600">{empty}</p>}
      {actions.length ? <WorkLinks items={actions} label="Start" className="mt-2 divide-y divide-pith-200 border-t border-pith-200" /> : null}
    </section>
  );
}
