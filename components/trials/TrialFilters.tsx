import Link from 'next/link';
import { TRIAL_STATUSES, TRIAL_STATUS_LABELS } from '@/lib/trials/vocabulary';
import { PRODUCT_CLASSES, PRODUCT_CLASS_LABELS } from '@/lib/formulas/schema';
import type { TrialListQuery } from '@/lib/trials/schema';
import { buttonClass } from '@/components/ui/Button';
import { DateInput } from '@/components/ui/DateInput';

const select = 'block w-full rounded-lg bg-white px-3 py-2 text-sm ring-1 ring-inset ring-rind-300';

/** A plain GET form: the filters live in the URL, so a filtered list can be bookmarked and shared. */
export function TrialFilters({ query, owners }: { query: TrialListQuery; owners: Array<{ id: string; name: string }> }) {
  return (
    <form method="get" className="mb-6 grid gap-3 rounded-card bg-pith-50 p-4 ring-1 ring-pith-300 sm:grid-cols-2 lg:grid-cols-[1fr_1fr_1fr_9rem_9rem_auto] lg:items-start" aria-label="Filter trials">
      <label className="text-sm">
        <span className="mb-1 block font-medium text-rind-700">Status</span>
        <select name="status" defaultValue={query.status ?? ''} className={select}>
          <option value="">All but shelved</option>
          {TRIAL_STATUSES.map((s) => <option key={s} value={s}>{TRIAL_STATUS_LABELS[s]}</option>)}
        </select>
      </label>
      <label className="text-sm">
        <span className="mb-1 block font-medium text-rind-700">Owner</span>
        <select name="owner" defaultValue={query.owner ?? ''} className={select}>
          <option value="">Anyone</option>
          {owners.map((o) => <option key={o.id} value={o.id}>{o.name}</option>)}
        </select>
      </label>
      <label className="text-sm">
        <span className="mb-1 block font-medium text-rind-700">Product</span>
        <select name="product" defaultValue={query.product ?? ''} className={select}>
          <option value="">Any product</option>
          {PRODUCT_CLASSES.map((p) => <option key={p} value={p}>{PRODUCT_CLASS_LABELS[p]}</option>)}
        </select>
      </label>
      <div className="text-sm">
        <label htmlFor="trials-from" className="mb-1 block font-medium text-rind-700">Started from</label>
        <DateInput id="trials-from" name="from" defaultValue={query.from ?? ''} className={select} />
      </div>
      <div className="text-sm">
        <label htmlFor="trials-to" className="mb-1 block font-medium text-rind-700">to</label>
        <DateInput id="trials-to" name="to" defaultValue={query.to ?? ''} className={select} />
      </div>
      <div className="flex gap-2 lg:pt-6">
        <button type="submit" className={buttonClass('secondary')}>Filter</button>
        <Link href="/trials" className={buttonClass('ghost')}>Clear</Link>
      </div>
    </form>
  );
}
