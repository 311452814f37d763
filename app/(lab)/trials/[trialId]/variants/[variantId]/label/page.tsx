import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getTrialOverview } from '@/lib/trials/queries';
import { variantLabel } from '@/lib/label/queries';
import { labelForPage, referenceOptions } from '@/lib/label/page-query';
import { can } from '@/lib/permissions';
import { TrialHeader } from '@/components/trials/TrialHeader';
import { LabelPageBody } from '@/components/label/LabelPageBody';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Variant label' };

export default async function VariantLabelPage({ params, searchParams }: { params: Promise<{ trialId: string; variantId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePage('trials.read');
  const p = await params;
  const trialId = pageId(p.trialId);
  const variantId = pageId(p.variantId);
  const trial = await orNotFound(getTrialOverview(actor, trialId));
  const { view, referenceError } = await labelForPage((await searchParams).reference, (q) => orNotFound(variantLabel(actor, trialId, variantId, q)));
  const variant = trial.variants.find((v) => v.id === variantId)!;
  return (
    <>
      <TrialHeader trial={trial} />
      <div className="no-print mb-4 flex flex-wrap items-baseline justify-between gap-3">
        <h2 className="text-2xl font-semibold">Label of variant {variant.label}</h2>
        <Link href={`/trials/${trialId}/variants/${variantId}`} className="text-sm text-damson-700 underline">Back to variant {variant.label}</Link>
      </div>
      <LabelPageBody view={view} apiPath={`/api/v1/trials/${trialId}/variants/${variantId}/label`} references={can(actor.role, 'formulas.read') ? await referenceOptions(actor) : undefined} referenceError={referenceError} />
    </>
  );
}
