import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getTrialOverview } from '@/lib/trials/queries';
import { listAttributes } from '@/lib/tastings/queries';
import { NewTastingForm } from '@/components/tastings/NewTastingForm';
import { suggestAttributes } from '@/lib/sensory';
import { PageHeader } from '@/components/ui/Card';
import { sentence } from '@/lib/format/words';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'New tasting' };

export default async function NewTastingPage({ params }: { params: Promise<{ trialId: string }> }) {
  const actor = await requirePage('tastings.run');
  const trial = await orNotFound(getTrialOverview(actor, pageId((await params).trialId)));
  const attributes = await listAttributes(actor);
  return (
    <>
      <PageHeader title={`New tasting for ${trial.code}`} lead={`${sentence(trial.title)} Samples get random three-digit codes and balanced serving orders.`} />
      <NewTastingForm trialId={trial.id} variants={trial.variants.map((v) => ({ id: v.id, label: v.label, description: v.description }))} attributes={attributes}
        suggestedAttributeIds={suggestAttributes(attributes, [...new Set(trial.variants.flatMap((v) => v.factorLevels.map((l) => l.factor)))])} />
    </>
  );
}
