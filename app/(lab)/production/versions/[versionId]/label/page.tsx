import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { versionLabel } from '@/lib/label/queries';
import { PageHeader } from '@/components/ui/Card';
import { LabelPageBody } from '@/components/label/LabelPageBody';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Version label' };

export default async function VersionLabelPage({ params }: { params: Promise<{ versionId: string }> }) {
  const actor = await requirePage('production.read');
  const versionId = pageId((await params).versionId);
  const view = await orNotFound(versionLabel(actor, versionId));
  return (
    <>
      <PageHeader title={`Label of ${view.subject.name}`} />
      <p className="no-print -mt-3 mb-4 text-sm"><Link href={`/production/versions/${versionId}`} className="text-damson-700 underline">Back to {view.subject.name}</Link></p>
      <LabelPageBody view={view} apiPath={`/api/v1/production-versions/${versionId}/label`} />
    </>
  );
}
