import { AppShell } from '@/components/shell/AppShell';
import { requirePage } from '@/lib/page-guard';
import { navFor } from '@/lib/navigation';
import { outboxAvailable } from '@/lib/outbox';
import { currentWorkspaces } from '@/lib/auth';

export const dynamic = 'force-dynamic';

/** Every signed-in page sits in here. The layout checks the session; each page checks its own permission. */
export default async function LabLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePage('account.self');
  // Read with the actor above: no second query.
  const workspaces = await currentWorkspaces();
  return (
    <AppShell actor={actor} nav={navFor(actor.role, { mailOutbox: outboxAvailable() })} workspaces={workspaces}>
      {children}
    </AppShell>
  );
}
