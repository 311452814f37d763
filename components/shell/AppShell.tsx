import Link from 'next/link';
import { SetwellWordmark } from '@/components/brand/SetwellMark';
import { ROLE_LABELS, type Actor } from '@/lib/permissions';
import type { NavItem } from '@/lib/navigation';
import type { WorkspaceChoice } from '@/lib/workspaces/schema';
import { NavLinks } from './NavLinks';
import { WorkspaceSwitcher } from './WorkspaceSwitcher';
import { MobileNav } from './MobileNav';

/** The staff frame: a side rail on wide screens, a top bar with a drawer on phones. */
export function AppShell({ actor, nav, workspaces, children }: { actor: Actor; nav: NavItem[]; workspaces: WorkspaceChoice[]; children: React.ReactNode }) {
  const identity = (
    <div className="space-y-3">
      <WorkspaceSwitcher current={actor.workspaceId} workspaces={workspaces} />
      <div className="rounded-lg bg-damson-50 px-3 py-2 text-sm">
        <p className="font-medium text-damson-900" data-testid="actor-name">
          {actor.name}
        </p>
        <p className="text-xs text-damson-700" data-testid="actor-role">
          {ROLE_LABELS[actor.role]}
        </p>
      </div>
      <Link href="/sign-out" className="block px-3 text-sm text-rind-600 underline-offset-2 hover:underline">
        Sign out
      </Link>
    </div>
  );
  return (
    <div className="min-h-screen lg:grid lg:grid-cols-[16rem_minmax(0,1fr)] print:block">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:px-3 focus:py-2">
        Skip to content
      </a>
      <aside className="no-print hidden border-r border-pith-300 bg-pith-50 lg:flex lg:flex-col lg:justify-between lg:p-5">
        <div>
          <Link href="/home" className="mb-8 block">
            <SetwellWordmark />
          </Link>
          <NavLinks items={nav} />
        </div>
        {identity}
      </aside>
      <MobileNav items={nav}>{identity}</MobileNav>
      <main id="main" className="mx-auto w-full min-w-0 max-w-6xl px-4 py-6 sm:px-8 sm:py-10 print:max-w-none print:p-0">
        {children}
      </main>
    </div>
  );
}
