import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getFormula } from '@/lib/formulas/queries';
import { FormulaHeader } from '@/components/formulas/FormulaHeader';
import { FormulaPrintSheet } from '@/components/formulas/FormulaPrintSheet';
import { PrintButton } from '@/components/ui/PrintButton';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Print formula' };

export default async function FormulaPrintPage({ params }: { params: Promise<{ formulaId: string }> }) {
  const actor = await requirePage('formulas.read');
  const formula = await orNotFound(getFormula(actor, pageId((await params).formulaId)));
  return (
    <>
      <FormulaHeader formula={formula} active="print" />
      <div className="no-print mb-4 flex items-center gap-3">
        <PrintButton />
        <p className="text-sm text-rind-500">Fits A4 and US Letter; the navigation is left off the paper.</p>
      </div>
      <FormulaPrintSheet formula={formula} massUnits={actor.massUnits} temperatureUnit={actor.temperatureUnit} printedAt={new Date().toISOString()} />
    </>
  );
}
