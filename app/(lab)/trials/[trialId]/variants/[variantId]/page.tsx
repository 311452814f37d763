import Link from 'next/link';
import { notFound } from 'next/navigation';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { getTrialOverview } from '@/lib/trials/queries';
import { computeFormula } from '@/lib/formulas/compute';
import { getEntry } from '@/lib/notebook/queries';
import { listUploads } from '@/lib/uploads/queries';
import type { FormulaRevisionView } from '@/lib/formulas/schema';
import type { VariantView } from '@/lib/trials/schema';
import { FACTOR_LABELS } from '@/lib/trials/vocabulary';
import { TrialHeader } from '@/components/trials/TrialHeader';
import { RevisionDiff } from '@/components/formulas/RevisionDiff';
import { ResultsPanel } from '@/components/formulas/ResultsPanel';
import { CookList } from '@/components/trials/CookList';
import { RecordCookForm } from '@/components/trials/RecordCookForm';
import { RemoveVariantButton } from '@/components/trials/RemoveVariantButton';
import { Attachments } from '@/components/trials/Attachments';
import { NotebookEditor } from '@/components/notebook/NotebookEditor';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Variant' };

/** The diff view compares revisions; a variant is shown to it as one. */
function asRevision(v: VariantView, trialId: string): FormulaRevisionView {
  return { formulaId: trialId, number: v.label.charCodeAt(0) - 64, name: `Variant ${v.label}`, settings: v.settings, lines: v.lines, note: v.description, createdAt: '', createdBy: { id: '', name: '' } };
}

export default async function VariantPage({ params }: { params: Promise<{ trialId: string; variantId: string }> }) {
  const actor = await requirePage('trials.read');
  const p = await params;
  const trialId = pageId(p.trialId);
  const variantId = pageId(p.variantId);
  const trial = await orNotFound(getTrialOverview(actor, trialId));
  const variant = trial.variants.find((v) => v.id === variantId);
  if (!variant) notFound();
  const base = trial.variants.find((v) => v.isBase)!;
  const [notebook, uploads] = await Promise.all([getEntry(actor, trialId, variantId), listUploads(actor, trialId, { variantId })]);
  const canEdit = can(actor.role, 'trials.write');

  return (
    <>
      <TrialHeader trial={trial} />
      <div className="mb-6 flex flex-wrap items-center justify-between gap-3">
        <div>
          <h2 className="text-2xl font-semibold">Variant {variant.label}{variant.isBase ? ' (base)' : ''}</h2>
          <p className="text-rind-700">{variant.description}</p>
          {variant.factorLevels.length ? (
            <p className="mt-1 text-sm text-rind-600">
              {variant.factorLevels.map((l) => `${FACTOR_LABELS[l.factor].name} ${l.value.toFixed(l.factor === 'sugar_ratio' ? 2 : 1)} ${FACTOR_LABELS[l.factor].unit}`).join(' · ')}
            </p>
          ) : null}
        </div>
        <div className="flex items-center gap-4">
          <Link href={`/trials/${trialId}/variants/${variantId}/label`} className="text-sm text-damson-700 underline">Label</Link>
          <Link href={`/trials/${trialId}`} className="text-sm text-damson-700 underline">All variants</Link>
          {canEdit && !variant.isBase && (trial.status === 'planning' || trial.status === 'cooking') ? (
            <RemoveVariantButton trialId={trialId} variantId={variant.id} label={variant.label} onDone={`/trials/${trialId}`} />
          ) : null}
        </div>
      </div>
      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_26rem]">
        <div className="min-w-0 space-y-6">
          {variant.isBase ? (
            <p className="text-sm text-rind-600">This is the base formula as it stands in revision {trial.baseFormula.revision}; the other variants are compared with it.</p>
          ) : (
            <section aria-labelledby="diff-title">
              <h3 id="diff-title" className="mb-2 text-lg font-semibold">Difference from the base (A)</h3>
              <RevisionDiff before={asRevision(base, trialId)} after={asRevision(variant, trialId)} massUnits={actor.massUnits} temperatureUnit={actor.temperatureUnit} title={`Variant ${base.label} → variant ${variant.label}`} sideLabels={{ before: `variant ${base.label}`, after: `variant ${variant.label}` }} />
            </section>
          )}
          <section aria-labelledby="cooks-title">
            <h3 id="cooks-title" className="mb-2 text-lg font-semibold">Cooks: measured against predicted</h3>
            <CookList trialId={trialId} cooks={variant.cooks} massUnits={actor.massUnits} temperatureUnit={actor.temperatureUnit} canEdit={canEdit} />
          </section>
          {variant.withdrawnCooks.length ? (
            <section aria-labelledby="withdrawn-title">
              <h3 id="withdrawn-title" className="mb-2 text-lg font-semibold">Withdrawn cooks</h3>
              <CookList trialId={trialId} cooks={variant.withdrawnCooks} massUnits={actor.massUnits} temperatureUnit={actor.temperatureUnit} canEdit={false} withdrawn />
            </section>
          ) : null}
          {canEdit ? <RecordCookForm trialId={trialId} variantId={variant.id} massUnits={actor.massUnits} temperatureUnit={actor.temperatureUnit} /> : null}
          <Attachments trialId={trialId} variantId={variant.id} uploads={uploads} canEdit={canEdit} />
          <NotebookEditor trialId={trialId} variantId={variant.id} initial={notebook} canEdit={canEdit} title={`Notebook for variant ${variant.label}`} />
        </div>
        <ResultsPanel outcome={computeFormula(variant.settings, variant.lines)} massUnits={actor.massUnits} temperatureUnit={actor.temperatureUnit} title="Predicted for this variant" />
      </div>
    </>
  );
}
