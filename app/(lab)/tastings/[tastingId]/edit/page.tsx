import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getTasting, listAttributes } from '@/lib/tastings/queries';
import { getTrialOverview } from '@/lib/trials/queries';
import { NewTastingForm } from '@/components/tastings/NewTastingForm';
import { PageHeader } from '@/components/ui/Card';
import { Notice } from '@/components/ui/Notice';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Change the tasting' };

export default async function EditTastingPage({ params }: { params: Promise<{ tastingId: string }> }) {
  const actor = await requirePage('tastings.run');
  const session = await orNotFound(getTasting(actor, pageId((await params).tastingId)));
  const back = <p className="text-sm text-rind-500"><Link href={`/tastings/${session.id}`} className="underline-offset-2 hover:underline">Back to the tasting</Link></p>;
  if (session.state !== 'draft') {
    return (
      <>
        {back}
        <PageHeader title={session.title} />
        <Notice tone="info">This tasting has opened: its set-up, codes and answers stay as they are.</Notice>
      </>
    );
  }
  const [trial, attributes] = await Promise.all([getTrialOverview(actor, session.trialId), listAttributes(actor)]);
  return (
    <>
      {back}
      <PageHeader title={`Change “${session.title}”`} lead="While a tasting is being set up you can change anything; sample codes are drawn afresh when you save." />
      <NewTastingForm
        trialId={trial.id}
        variants={trial.variants.map((v) => ({ id: v.id, label: v.label, description: v.description }))}
        attributes={attributes}
        suggestedAttributeIds={session.ratedAttributeIds}
        editing={{
          id: session.id, title: session.title, place: session.place, startsAt: session.startsAt, method: session.method,
          variantIds: session.samples.map((x) => x.variantId), attributeIds: session.ratedAttributeIds, rankingAttributeId: session.rankingAttributeId, notice: session.notice,
        }}
      />
    </>
  );
}
