import Link from 'next/link';
import { requirePage } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { listTrials } from '@/lib/trials/queries';
import { trialListQuerySchema } from '@/lib/trials/schema';
import { listMembers } from '@/lib/members/queries';
import { PRODUCT_CLASS_LABELS } from '@/lib/formulas/schema';
import { PageHeader, EmptyState } from '@/components/ui/Card';
import { buttonClass } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { StatusBadge } from '@/components/trials/StatusBadge';
import { TrialFilters } from '@/components/trials/TrialFilters';
import { formatDate } from '@/lib/format/dates';
import { TableBox } from '@/components/ui/TableBox';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Trials' };

export default async function TrialsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePage('trials.read');
  const raw = Object.fromEntries(Object.entries(await searchParams).filter(([, v]) => v !== ''));
  const parsed = trialListQuerySchema.safeParse(raw);
  const query = parsed.success ? parsed.data : {};
  const [trials, people] = await Promise.all([listTrials(actor, query), listMembers(actor)]);
  const canCreate = can(actor.role, 'trials.write');
  const filtered = Object.keys(query).length > 0;
  return (
    <>
      <PageHeader
        title="Trials"
        lead="A question, a base formula, the variants you cook to answer it, and the write-up."
        actions={canCreate ? <Link href="/trials/new" className={buttonClass('primary')}>Start a trial</Link> : null}
      />
      <TrialFilters query={query} owners={people.members.filter((m) => m.active).map((m) => ({ id: m.userId, name: m.name }))} />
      {!parsed.success ? <div className="mb-4"><Notice tone="warning">Some filters in the address were not understood and were ignored.</Notice></div> : null}
      {trials.length === 0 ? (
        filtered ? (
          <EmptyState title="No trial matches these filters" action={<Link href="/trials" className="text-damson-700 underline">Show all trials</Link>} />
        ) : (
          <EmptyState title="No trials yet" action={canCreate ? <Link href="/trials/new" className="text-damson-700 underline">Start your first trial</Link> : null}>
            Pick a formula, say what you want to find out, and let the plan helper lay out the variants to cook.
          </EmptyState>
        )
      ) : (
        <TableBox label="Trials">
          <table className="min-w-full divide-y divide-pith-300 bg-pith-50 text-sm" data-testid="trial-list">
            <thead className="bg-pith-200 text-left text-xs uppercase tracking-wider text-rind-600">
              <tr>
                <th scope="col" className="px-4 py-3">Trial</th>
                <th scope="col" className="px-4 py-3">Status</th>
                <th scope="col" className="px-4 py-3">Base formula</th>
                <th scope="col" className="px-4 py-3">Variants</th>
                <th scope="col" className="px-4 py-3">Owner</th>
                <th scope="col" className="px-4 py-3">Started</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-pith-200">
              {trials.map((t) => (
                <tr key={t.id}>
                  <td className="px-4 py-3">
                    <Link href={`/trials/${t.id}`} className="font-medium text-damson-800 underline-offset-2 hover:underline">
                      <span className="mr-2 font-mono text-xs text-rind-500">{t.code}</span>{t.title}
                    </Link>
                  </td>
                  <td className="px-4 py-3"><StatusBadge status={t.status} /></td>
                  <td className="px-4 py-3">{t.baseFormulaName}{t.productClass ? <> <span className="text-xs text-rind-500">({PRODUCT_CLASS_LABELS[t.productClass]})</span></> : null}</td>
                  <td className="px-4 py-3 tabular-nums">{t.variantCount}</td>
                  <td className="px-4 py-3">{t.ownerName}</td>
                  <td className="px-4 py-3 text-rind-600">{formatDate(t.createdAt)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableBox>
      )}
    </>
  );
}
