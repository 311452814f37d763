import Link from 'next/link';
import { requirePage, orNotFound } from '@/lib/page-guard';
import { modelPage, type SearchValue } from '@/lib/modelling/page-query';
import { ModelReport } from '@/components/models/ModelReport';
import { PageHeader } from '@/components/ui/Card';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Model' };

/** One product family's data set, model, diagnostics, contour and history. */
export default async function FamilyModelPage({ params, searchParams }: { params: Promise<{ family: string }>; searchParams: Promise<Record<string, SearchValue>> }) {
  const actor = await requirePage('models.read');
  const data = await orNotFound(modelPage(actor, (await params).family, await searchParams));
  return (
    <>
      <PageHeader title={data.family.name} lead="Every cooked and tasted variant of this product family, described by its formula, and a least-squares model of one response at a time." />
      <p className="-mt-3 mb-6 text-sm"><Link href="/models" className="text-damson-700 underline">All product families</Link></p>
      <ModelReport data={data} />
    </>
  );
}
