import Link from 'next/link';
import { requirePage } from '@/lib/page-guard';
import { navFor } from '@/lib/navigation';
import { outboxAvailable } from '@/lib/outbox';
import { PageHeader, Card } from '@/components/ui/Card';
import { ROLE_LABELS, can, type Role } from '@/lib/permissions';
import { listProducts, reviewQueue } from '@/lib/production/queries';
import { Notice } from '@/components/ui/Notice';

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
  const shortcuts = navFor(actor.role, { mailOutbox: outboxAvailable() }).filter((n) => n.href !== '/home');
  // What waits for this person: the review queue for a decider, the products for the kitchen.
  const queue = can(actor.role, 'promotion.decide') ? (await reviewQueue(actor)).filter((r) => !r.ownRequest) : [];
  const kitchen = can(actor.role, 'batches.record') ? (await listProducts(actor)).filter((p) => p.current) : [];
  return (
    <>
      <PageHeader title={`Good to see you, ${actor.name.split(' ')[0]}`} lead={ROLE_LEADS[actor.role]} />
      <p className="mb-6 text-sm text-rind-600">
        You are working in <strong>{actor.workspaceName}</strong> as {ROLE_LABELS[actor.role]}.
      </p>
      {queue.length ? (
        <div className="mb-6">
          <Notice tone="warning" title={`${queue.length} promotion request${queue.length === 1 ? '' : 's'} waiting for your decision`}>
            <ul className="mt-1 space-y-1">{queue.map((r) => <li key={r.id}><Link className="underline" href={`/production/reviews/${r.id}`}>{r.code}: {r.trial.code} variant {r.variantLabel} → {r.productLabel}</Link></li>)}</ul>
          </Notice>
        </div>
      ) : null}
      {kitchen.length ? (
        <div className="mb-6">
          <Notice tone="info" title="In production">
            <ul className="mt-1 space-y-1">{kitchen.map((p) => (
              <li key={p.id}>{p.name} v{p.current!.version}: <Link className="underline" href={`/production/versions/${p.current!.id}/sheet`}>batch sheet</Link> · <Link className="underline" href={`/production/versions/${p.current!.id}/batches/new`}>record a batch</Link></li>
            ))}</ul>
          </Notice>
        </div>
      ) : null}
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
