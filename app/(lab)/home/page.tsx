import Link from 'next/link';
import { requirePage } from '@/lib/page-guard';
import { navFor } from '@/lib/navigation';
import { PageHeader, Card } from '@/components/ui/Card';
import { ROLE_LABELS, type Role } from '@/lib/permissions';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Overview' };

const ROLE_LEADS: Record<Role, string> = {
  admin: 'Invite your team, give each person a role, and keep the workspace tidy.',
  developer: 'Build formulas from the ingredient library and see the batch, the set and the rules while you type.',
  head_of_product: 'Review the evidence behind each promotion request and decide what reaches the kitchen.',
  production: 'Print the batch sheet for your kettle, record each batch, and see it checked against its spec.',
  taster: 'When an organiser seats you at a tasting, it appears under My tastings.',
};

export default async function HomePage() {
  const actor = await requirePage('account.self');
  const shortcuts = navFor(actor.role).filter((n) => n.href !== '/home');
  return (
    <>
      <PageHeader title={`Good to see you, ${actor.name.split(' ')[0]}`} lead={ROLE_LEADS[actor.role]} />
      <p className="mb-6 text-sm text-rind-600">
        You are working in <strong>{actor.workspaceName}</strong> as {ROLE_LABELS[actor.role]}.
      </p>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        {shortcuts.map((s) => (
          <Link key={s.href} href={s.href} className="group">
            <Card className="h-full transition-shadow group-hover:ring-damson-300">
              <p className="font-display text-lg text-damson-900">{s.label}</p>
            </Card>
          </Link>
        ))}
      </div>
    </>
  );
}
