'use client';

import { useState } from 'react';
import Link from 'next/link';
import { SetwellWordmark } from '@/components/brand/SetwellMark';
import type { NavItem } from '@/lib/navigation';
import { NavLinks } from './NavLinks';

export function MobileNav({ items, children }: { items: NavItem[]; children: React.ReactNode }) {
  const [open, setOpen] = useState(false);
  return (
    <div className="no-print border-b border-pith-300 bg-pith-50 lg:hidden">
      <div className="flex items-center justify-between px-4 py-3">
        <Link href="/home">
          <SetwellWordmark />
        </Link>
        <button
          type="button"
          className="min-h-10 rounded-lg px-3 text-sm font-semibold text-damson-800 ring-1 ring-damson-200"
          aria-expanded={open}
          aria-controls="mobile-nav"
          onClick={() => setOpen((v) => !v)}
        >
          {open ? 'Close' : 'Menu'}
        </button>
      </div>
      {open ? (
        <div id="mobile-nav" className="space-y-4 px-4 pb-5">
          <NavLinks items={items} onNavigate={() => setOpen(false)} />
          {children}
        </div>
      ) : null}
    </div>
  );
}
