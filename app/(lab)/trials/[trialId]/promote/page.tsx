import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getPromotionDraft } from '@/lib/production/queries';
import { PageHeader } from '@/components/ui/Card';
import { Notice } from '@/components/ui/Notice';
import { PromotionForm } from '@/components/production/PromotionForm';
import { sentence } from '@/lib/format/words';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Request promotion' };

export default async function PromotePage({ params }: { params: Promise<{ trialId: string }> }) {
  const actor = await requirePage('promotion.request');
  const draft = await orNotFound(getPromotionDraft(actor, pageId((await params).trialId)));
  return (
    <>
      <PageHeader title={`Promote from ${draft.trial.code}`} lead={`${sentence(draft.trial.title)} The head of product reviews the request with its evidence and approves or sends it back.`} />
      <p className="-mt-3 mb-6 text-sm"><Link href={`/trials/${draft.trial.id}/compare`} className="text-damson-700 underline">Back to the comparison</Link></p>
      {draft.pending ? (
        <Notice tone="info" title={`${draft.pending.code} is awaiting review`}>
          This trial already has an open request. <Link className="underline" href={`/production/reviews/${draft.pending.id}`}>Open it</Link> to follow it or withdraw it.
        </Notice>
      ) : (
        <>
        {draft.resubmission ? (
          <div className="mb-6"><Notice tone="warning" title={`${draft.resubmission.code} was sent back`}>
            <p className="whitespace-pre-line">{draft.resubmission.sentBackBecause}</p>
            <p className="mt-1">The form starts from what <Link className="underline" href={`/production/reviews/${draft.resubmission.id}`}>{draft.resubmission.code}</Link> asked for; the new request is linked to it.</p>
          </Notice></div>
        ) : null}
        <PromotionForm trialId={draft.trial.id} variants={draft.variants} products={draft.products} recommendedVariantId={draft.recommendedVariantId} recommendationRationale={draft.recommendationRationale} temperatureUnit={actor.temperatureUnit} resubmission={draft.resubmission} />
        </>
      )}
    </>
  );
}
