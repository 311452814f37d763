import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getFormula, listRevisions } from '@/lib/formulas/queries';
import { FormulaHeader } from '@/components/formulas/FormulaHeader';
import { RevisionDiff } from '@/components/formulas/RevisionDiff';
import { buttonClass } from '@/components/ui/Button';
import { formatDate, formatDateTime } from '@/lib/format/dates';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Formula history' };

/** Revisions newest first; ?a=1&b=3 compares two of them (default: the latest against the one before). */
export default async function FormulaHistoryPage({ params, searchParams }: { params: Promise<{ formulaId: string }>; searchParams: Promise<{ a?: string; b?: string }> }) {
  const actor = await requirePage('formulas.read');
  const formulaId = pageId((await params).formulaId);
  const formula = await orNotFound(getFormula(actor, formulaId));
  const revisions = await listRevisions(actor, formulaId);
  const q = await searchParams;
  const byNumber = new Map(revisions.map((r) => [r.number, r]));
  const latest = revisions[0];
  const after = byNumber.get(Number(q.b)) ?? latest;
  const before = byNumber.get(Number(q.a)) ?? revisions.find((r) => r.number < after.number) ?? after;
  const options = revisions.map((r) => (
    <option key={r.number} value={r.number}>
      Revision {r.number} — {r.createdBy.name}, {formatDate(r.createdAt)}
    </option>
  ));

  return (
    <>
      <FormulaHeader formula={formula} active="history" />
      <div className="grid grid-cols-1 gap-6 lg:grid-cols-[20rem_minmax(0,1fr)]">
        <section aria-labelledby="revisions-title">
          <h2 id="revisions-title" className="mb-3 text-lg font-semibold">Revisions</h2>
          <ol className="space-y-2" data-testid="revision-list">
            {revisions.map((r) => (
              <li key={r.number} className="rounded-lg bg-pith-50 p-3 text-sm ring-1 ring-pith-300">
                <p className="font-medium">Revision {r.number}</p>
                <p className="text-xs text-rind-500">{r.createdBy.name} · {formatDateTime(r.createdAt)}</p>
                {r.note ? <p className="mt-1 text-rind-700">{r.note}</p> : null}
              </li>
            ))}
          </ol>
        </section>
        <section aria-labelledby="compare-title">
          <h2 id="compare-title" className="mb-3 text-lg font-semibold">Compare two revisions</h2>
          {revisions.length < 2 ? (
            <p className="text-sm text-rind-600">There is only one revision so far. Save a change and you can compare them line by line here.</p>
          ) : (
            <>
              <form method="get" className="mb-4 flex flex-wrap items-end gap-3">
                <label className="text-sm">
                  <span className="mb-1 block font-medium text-rind-700">From</span>
                  <select name="a" defaultValue={before.number} className="rounded-lg bg-white px-3 py-2 ring-1 ring-rind-300">{options}</select>
                </label>
                <label className="text-sm">
                  <span className="mb-1 block font-medium text-rind-700">To</span>
                  <select name="b" defaultValue={after.number} className="rounded-lg bg-white px-3 py-2 ring-1 ring-rind-300">{options}</select>
                </label>
                <button type="submit" className={buttonClass('secondary')}>Compare</button>
                <Link href={`/formulas/${formulaId}/history`} className="text-sm text-damson-700 underline">Latest change</Link>
              </form>
              <RevisionDiff before={before} after={after} massUnits={actor.massUnits} temperatureUnit={actor.temperatureUnit} />
            </>
          )}
        </section>
      </div>
    </>
  );
}
