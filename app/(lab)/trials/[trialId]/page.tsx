import { Suspense } from 'react';
import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { getTrialOverview } from '@/lib/trials/queries';
import { measureFactor, type MassLine } from '@/lib/trials/plan';
import { TRIAL_FACTORS, TRIAL_STATUS_LABELS, type TrialFactor } from '@/lib/trials/vocabulary';
import { resolveLines } from '@/lib/chemistry';
import { readEntry } from '@/lib/notebook/queries';
import { readUploads } from '@/lib/uploads/queries';
import { TrialHeader } from '@/components/trials/TrialHeader';
import { StatusControls } from '@/components/trials/StatusControls';
import { VariantsTable } from '@/components/trials/VariantsTable';
import { trialCosts } from '@/lib/costs/queries';
import { FillMismatchNotice, variantCostTexts } from '@/components/costs/CostSummary';
import { PlanHelper } from '@/components/trials/PlanHelper';
import { CsvImport } from '@/components/trials/CsvImport';
import { Attachments } from '@/components/trials/Attachments';
import { NotebookEditor } from '@/components/notebook/NotebookEditor';
import { listTrialTastings } from '@/lib/tastings/queries';
import type { TrialTastingRow } from '@/lib/tastings/schema';
import { TASTING_METHOD_LABELS, TASTING_STATE_LABELS } from '@/lib/tastings/vocabulary';
import { buttonClass } from '@/components/ui/Button';
import { formatDate, formatDateTime } from '@/lib/format/dates';
import { Skeleton } from '@/components/ui/Skeleton';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Trial' };

function baseLevelsOf(lines: MassLine[], settings: { targetSolidsPct: number }): Record<TrialFactor, number | null> {
  return Object.fromEntries(
    TRIAL_FACTORS.map((f) => {
      try {
        const v = measureFactor(lines, f, settings);
        return [f, v > 0 || f === 'sugar_ratio' ? v : null];
      } catch {
        return [f, null];
      }
    }),
  ) as Record<TrialFactor, number | null>;
}

export default async function TrialPage({ params }: { params: Promise<{ trialId: string }> }) {
  const actor = await requirePage('trials.read');
  const trialId = pageId((await params).trialId);
  // The tastings list streams in below, but its read starts now, beside the others (scoped to the
  // workspace, so it reveals nothing when the trial turns out not to exist; nobody awaits it then).
  const tastings = can(actor.role, 'tastings.read') ? listTrialTastings(actor, trialId) : null;
  tastings?.catch(() => undefined);
  // Four reads at once, each on its own forked EntityManager. The overview checks the trial (a 404
  // otherwise); the notebook, the uploads and the costs are workspace-scoped reads of the same
  // trial, so they skip their own check of it. The tastings list streams in below (TrialTastings).
  const [trial, notebook, uploads, costs] = await orNotFound(
    Promise.all([
      getTrialOverview(actor, trialId),
      readEntry(actor, trialId, null),
      readUploads(actor, trialId),
      can(actor.role, 'prices.read') ? trialCosts(actor, trialId) : Promise.resolve(null),
    ]),
  );
  const costPerJar = costs ? variantCostTexts(costs) : undefined;
  const canEdit = can(actor.role, 'trials.write');
  const editable = canEdit && (trial.status === 'planning' || trial.status === 'cooking');
  const base = trial.variants.find((v) => v.isBase)!;
  const baseMass = resolveLines(base.lines.map((l) => ({ ingredient: l.ingredient, quantity: l.quantity, unit: l.unit }))).map((r) => ({ ingredient: r.ingredient, massG: r.massG }));

  return (
    <>
      <TrialHeader trial={trial}>
        <div className="flex flex-wrap items-center gap-3">
          {canEdit ? <StatusControls trialId={trial.id} status={trial.status} /> : null}
          <a href={`/api/v1/trials/${trial.id}/export`} className={buttonClass('ghost')}>Download CSV</a>
          <Link href={`/trials/${trial.id}/print`} className={buttonClass('ghost')}>Print view</Link>
          {can(actor.role, 'tastings.read') ? <Link href={`/trials/${trial.id}/compare`} className={buttonClass('ghost')}>Compare variants</Link> : null}
        </div>
      </TrialHeader>

      <div className="grid gap-6 2xl:grid-cols-[minmax(0,1fr)_28rem]">
        <div className="min-w-0 space-y-6">
          <section aria-labelledby="variants-title">
            <h2 id="variants-title" className="mb-3 text-xl font-semibold">Variants</h2>
            <VariantsTable trialId={trial.id} variants={trial.variants} massUnits={actor.massUnits} temperatureUnit={actor.temperatureUnit} costPerJar={costPerJar} />
            {costs ? <div className="mt-2"><FillMismatchNotice results={costs.variants.map((v) => ({ label: `Variant ${v.label}`, result: v.result }))} testId="variant-cost-fill" /></div> : null}
            <p className="mt-2 text-xs text-rind-500">Measured values are coloured against their prediction: green within tolerance, amber worth a look, red out of window; a red block means a food-safety limit.</p>
          </section>
          {editable ? <PlanHelper trialId={trial.id} baseLevels={baseLevelsOf(baseMass, base.settings)} /> : canEdit ? (
            <p className="text-sm text-rind-600">Variants are fixed while the trial is “{TRIAL_STATUS_LABELS[trial.status]}”. Move it back to “{TRIAL_STATUS_LABELS.cooking}” to change them.</p>
          ) : null}
          <section aria-labelledby="panels-title" className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
            <div className="flex flex-wrap items-center justify-between gap-2">
              <h2 id="panels-title" className="text-lg font-semibold">Tastings</h2>
              {can(actor.role, 'tastings.run') ? <Link href={`/trials/${trial.id}/tastings/new`} className={buttonClass('secondary')}>New tasting</Link> : null}
            </div>
            {tastings ? (
              <Suspense fallback={<div className="mt-3"><Skeleton what="the tastings" lines={2} /></div>}>
                <TrialTastings read={tastings} />
              </Suspense>
            ) : <NoTastingYet />}
          </section>
          {canEdit ? <CsvImport trialId={trial.id} /> : null}
          <Attachments trialId={trial.id} uploads={uploads} canEdit={canEdit} />
          <section aria-labelledby="history-title">
            <h2 id="history-title" className="mb-2 text-lg font-semibold">History</h2>
            <ol className="space-y-1 text-sm text-rind-700">
              {[
                ...trial.history.map((h) => ({
                  at: h.at,
                  text: `${h.from ? `${TRIAL_STATUS_LABELS[h.from]} → ` : ''}${TRIAL_STATUS_LABELS[h.to]} by ${h.byName}${h.note ? ` (“${h.note}”)` : ''}`,
                })),
                ...trial.variants.flatMap((v) => [...v.cooks, ...v.withdrawnCooks].flatMap((m) => m.changes.map((c) => ({
                  at: c.at,
                  text: `Cook of ${formatDate(m.cookDate)} (variant ${v.label}) ${c.kind === 'withdrawn' ? 'withdrawn' : 'corrected'} by ${c.byName} (“${c.reason}”)`,
                })))),
              ].sort((x, y) => x.at.localeCompare(y.at)).map((h, i) => (
                <li key={i}>{formatDateTime(h.at)} — {h.text}</li>
              ))}
            </ol>
          </section>
        </div>
        <aside aria-label="Trial notebook" className="min-w-0">
          <NotebookEditor trialId={trial.id} variantId={null} initial={notebook} canEdit={canEdit} title="Trial notebook" />
        </aside>
      </div>
    </>
  );
}

function NoTastingYet() {
  return <p className="mt-2 text-sm text-rind-600">No tasting yet. When the variants are cooked, set up a blind tasting: codes and serving orders are drawn for you.</p>;
}

/**
 * The trial's tastings, read while the rest of the page is already on screen. It decides no 404
 * or 403 (the page did, before streaming began; one decided here would go out as HTTP 200).
 */
async function TrialTastings({ read }: { read: Promise<TrialTastingRow[]> }) {
  const tastings = await read;
  if (tastings.length === 0) return <NoTastingYet />;
  return (
    <ul className="mt-3 divide-y divide-pith-200 text-sm" data-testid="tasting-list">
      {tastings.map((p) => (
        <li key={p.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
          <Link href={`/tastings/${p.id}`} className="font-medium text-damson-800 underline-offset-2 hover:underline">{p.title}</Link>
          <span className="text-rind-600">{TASTING_METHOD_LABELS[p.method]} · {TASTING_STATE_LABELS[p.state]} · {p.submitted} of {p.seats} seats submitted</span>
        </li>
      ))}
    </ul>
  );
}
