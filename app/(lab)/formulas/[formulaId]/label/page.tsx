import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getFormula } from '@/lib/formulas/queries';
import { formulaLabel } from '@/lib/label/queries';
import { labelForPage, referenceOptions } from '@/lib/label/page-query';
import { FormulaHeader } from '@/components/formulas/FormulaHeader';
import { LabelPageBody } from '@/components/label/LabelPageBody';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Formula label' };

export default async function FormulaLabelPage({ params, searchParams }: { params: Promise<{ formulaId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePage('formulas.read');
  const formulaId = pageId((await params).formulaId);
  const formula = await orNotFound(getFormula(actor, formulaId));
  const { view, referenceError } = await labelForPage((await searchParams).reference, (q) => formulaLabel(actor, formulaId, q));
  return (
    <>
      <FormulaHeader formula={formula} active="label" />
      <LabelPageBody view={view} apiPath={`/api/v1/formulas/${formulaId}/label`} references={await referenceOptions(actor, formulaId)} referenceError={referenceError} />
    </>
  );
}
