import { requirePage } from '@/lib/page-guard';
import { listTrialBases } from '@/lib/trials/queries';
import { NewTrialForm } from '@/components/trials/NewTrialForm';
import { PageHeader } from '@/components/ui/Card';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Start a trial' };

export default async function NewTrialPage({ searchParams }: { searchParams: Promise<{ formula?: string }> }) {
  const actor = await requirePage('trials.write');
  const bases = await listTrialBases(actor);
  const { formula } = await searchParams;
  return (
    <>
      <PageHeader title="Start a trial" lead="A trial answers one question by cooking variants of one formula revision." />
      <NewTrialForm bases={bases} preselected={bases.some((b) => b.formulaId === formula) ? formula : undefined} />
    </>
  );
}
