'use client';

import Link, { useLinkStatus } from 'next/link';
import { usePathname } from 'next/navigation';
import type { NavItem } from '@/lib/navigation';

/**
 * A pulsing dot beside the link while its page loads: pages have no loading.tsx (it would stream a
 * 404 or 403 as HTTP 200), so this is the feedback that the click was taken.
 */
export function PendingMark() {
  const { pending } = useLinkStatus();
  if (!pending) return null;
  return (
    <span role="status" className="ml-2 inline-flex items-center align-middle" data-testid="nav-pending">
      <span aria-hidden="true" className="h-2 w-2 animate-pulse rounded-full bg-current motion-reduce:animate-none" />
      <span className="sr-only">Loading…</span>
    </span>
  );
}

export function NavLinks({ items, onNavigate }: { items: NavItem[]; onNavigate?: () => void }) {
  const path = usePathname();
  // The most specific entry wins: /production/reviews lights "Promotion reviews", not "Production" too.
  const matches = (href: string) => path === href || path.startsWith(href + '/');
  const activeHref = items.filter((i) => matches(i.href)).sort((x, y) => y.href.length - x.href.length)[0]?.href;
  const groups: Array<{ key: NavItem['group']; label: string }> = [
    { key: 'work', label: 'Work' },
    { key: 'settings', label: 'Workspace' },
  ];
  return (
    <nav aria-label="Main" data-testid="main-nav">
      {groups.map((g) => {
        const inGroup = items.filter((i) => i.group === g.key);
        if (!inGroup.length) return null;
        return (
          <div key={g.key} className="mb-6">
            <p className="mb-2 px-3 text-xs font-semibold uppercase tracking-wider text-rind-400">{g.label}</p>
            <ul className="space-y-1">
              {inGroup.map((item) => {
                const active = item.href === activeHref;
                return (
                  <li key={item.href}>
                    <Link
                      href={item.href}
                      onClick={onNavigate}
                      aria-current={active ? 'page' : undefined}
                      className={`block rounded-lg px-3 py-2 text-sm font-medium ${
                        active ? 'bg-damson-700 text-pith-50' : 'text-rind-700 hover:bg-damson-50 hover:text-damson-900'
                      }`}
                    >
                      {item.label}
                      <PendingMark />
                    </Link>
                  </li>
                );
              })}
            </ul>
          </div>
        );
      })}
    </nav>
  );
}
