import Link from 'next/link';
import { redirect } from 'next/navigation';
import { requirePage } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { listTastings } from '@/lib/tastings/queries';
import { tastingListQuerySchema } from '@/lib/tastings/schema';
import { listTrials } from '@/lib/trials/queries';
import { TASTING_METHOD_LABELS, TASTING_STATES, TASTING_STATE_LABELS } from '@/lib/tastings/vocabulary';
import { PageHeader, EmptyState } from '@/components/ui/Card';
import { buttonClass } from '@/components/ui/Button';
import { formatDate } from '@/lib/format/dates';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Tastings' };

const select = 'block w-full rounded-lg bg-white px-3 py-2 text-sm ring-1 ring-inset ring-rind-300';

/** Every tasting of the workspace; the filters live in the URL so a filtered list can be shared. */
export default async function TastingsPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const actor = await requirePage('tastings.own');
  // Before issue 18 this address was "My tastings": whoever cannot read the workspace's tastings is sent there.
  if (!can(actor.role, 'tastings.read')) redirect('/tastings/mine');
  const raw = Object.fromEntries(Object.entries(await searchParams).filter(([, v]) => v !== ''));
  const parsed = tastingListQuerySchema.safeParse(raw);
  const query = parsed.success ? parsed.data : {};
  const [tastings, trials] = await Promise.all([listTastings(actor, { state: query.state, trialId: query.trial }), listTrials(actor)]);
  const filtered = Boolean(query.state || query.trial);
  return (
    <>
      <PageHeader title="Tastings" lead="Every blind tasting of the workspace: being set up, taking answers or closed. Start a new one from its trial." />
      <form method="get" aria-label="Filter tastings" className="mb-6 grid gap-3 rounded-card bg-pith-50 p-4 ring-1 ring-pith-300 sm:grid-cols-[1fr_1fr_auto] sm:items-end">
        <label className="text-sm">
          <span className="mb-1 block font-medium text-rind-700">State</span>
          <select name="state" defaultValue={query.state ?? ''} className={select}>
            <option value="">Any state</option>
            {TASTING_STATES.map((s) => <option key={s} value={s}>{TASTING_STATE_LABELS[s]}</option>)}
          </select>
        </label>
        <label className="text-sm">
          <span className="mb-1 block font-medium text-rind-700">Trial</span>
          <select name="trial" defaultValue={query.trial ?? ''} className={select}>
            <option value="">Any trial</option>
            {trials.map((t) => <option key={t.id} value={t.id}>{t.code}: {t.title}</option>)}
          </select>
        </label>
        <div className="flex gap-3">
          <button type="submit" className={buttonClass('secondary')}>Show</button>
          {filtered ? <Link href="/tastings" className={buttonClass('ghost')}>Clear</Link> : null}
        </div>
      </form>
      {tastings.length === 0 ? (
        <EmptyState title={filtered ? 'No tasting matches these filters' : 'No tastings yet'}>
          {filtered ? 'Clear the filters to see every tasting.' : 'When a trial’s variants are cooked, open the trial and set up a blind tasting: codes and serving orders are drawn for you.'}
        </EmptyState>
      ) : (
        <ul className="divide-y divide-pith-200 rounded-card bg-pith-50 ring-1 ring-pith-300" data-testid="tasting-list">
          {tastings.map((t) => (
            <li key={t.id} className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 px-4 py-3">
              <div className="min-w-0">
                <Link href={`/tastings/${t.id}`} className="font-medium text-damson-800 underline">{t.title}</Link>
                <p className="text-sm text-rind-600">
                  <Link href={`/trials/${t.trial.id}`} className="underline">{t.trial.code}</Link> {t.trial.title} · {TASTING_METHOD_LABELS[t.method]}
                  {t.place ? ` · ${t.place}` : ''}{t.startsAt ? ` · ${formatDate(t.startsAt)}` : ''}
                </p>
              </div>
              <p className="text-sm text-rind-700">
                {TASTING_STATE_LABELS[t.state]}{t.state === 'draft' ? '' : ` · ${t.submitted} of ${t.seats} tasters finished`}
              </p>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
