import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getPanelSession, listAttributes } from '@/lib/panels/queries';
import { getTrialOverview } from '@/lib/trials/queries';
import { NewPanelForm } from '@/components/panels/NewPanelForm';
import { PageHeader } from '@/components/ui/Card';
import { Notice } from '@/components/ui/Notice';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Change the tasting' };

export default async function EditPanelPage({ params }: { params: Promise<{ sessionId: string }> }) {
  const actor = await requirePage('panels.run');
  const session = await orNotFound(getPanelSession(actor, pageId((await params).sessionId)));
  const back = <p className="text-sm text-rind-500"><Link href={`/panels/${session.id}`} className="underline-offset-2 hover:underline">Back to the tasting</Link></p>;
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
      <NewPanelForm
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
