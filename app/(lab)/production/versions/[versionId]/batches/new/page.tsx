import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getProductionVersion, takenLotCodes } from '@/lib/production/queries';
import { PageHeader } from '@/components/ui/Card';
import { Notice } from '@/components/ui/Notice';
import { BatchForm } from '@/components/production/BatchForm';
import { todayIso } from '@/lib/format/dates';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Record a batch' };

export default async function NewBatchPage({ params }: { params: Promise<{ versionId: string }> }) {
  const actor = await requirePage('batches.record');
  const v = await orNotFound(getProductionVersion(actor, pageId((await params).versionId)));
  return (
    <>
      <PageHeader title={`Record a batch of ${v.product.name}`} lead={`Made to v${v.version}. Each reading is checked against its spec as you enter it.`} />
      <p className="-mt-3 mb-6 text-sm"><Link href={`/production/versions/${v.id}`} className="text-damson-700 underline">Back to v{v.version}</Link></p>
      {v.status !== 'current' ? (
        <Notice tone="warning" title="This version is superseded">Record batches against the version in production.</Notice>
      ) : (
        <BatchForm versionId={v.id} spec={v.spec} productCode={v.product.code} takenLotCodes={await takenLotCodes(actor, v.product.id)} today={todayIso()} temperatureUnit={actor.temperatureUnit} massUnits={actor.massUnits} />
      )}
    </>
  );
}
