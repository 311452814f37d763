import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { getFormula } from '@/lib/formulas/queries';
import { familyModel, familyOfFormula } from '@/lib/modelling/queries';
import { fruitMinimumOf } from '@/lib/modelling/proposals';
import { editorCostBasis } from '@/lib/costs/queries';
import { packFormatOfFormulas } from '@/lib/pricing/queries';
import { FormulaHeader } from '@/components/formulas/FormulaHeader';
import { ProposalForm } from '@/components/modelling/ProposalForm';
import { EmptyState } from '@/components/ui/Card';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Propose a formula' };

/** "Propose a formula": the optimiser on the model of the formula's product family. */
export default async function ProposePage({ params }: { params: Promise<{ formulaId: string }> }) {
  const actor = await requirePage('trials.read');
  const formulaId = pageId((await params).formulaId);
  // Prices and the formula's pack format only for users who may see prices (the cost ceiling and
  // each proposal's cost per jar); workspace-scoped, so another workspace's formula reveals nothing.
  const prices = can(actor.role, 'prices.read');
  const [formula, family, costBasis, packFormats] = await orNotFound(
    Promise.all([
      getFormula(actor, formulaId),
      familyOfFormula(actor, formulaId),
      prices ? editorCostBasis(actor) : Promise.resolve(null),
      prices ? packFormatOfFormulas(actor.workspaceId, [formulaId]) : Promise.resolve(null),
    ]),
  );
  const model = family ? await familyModel(actor, family) : null;
  const c = formula.current;
  const base = { settings: c.settings, lines: c.lines };
  const cost = costBasis && packFormats ? { basis: costBasis, packFormatId: packFormats.get(formula.id) ?? null } : undefined;
  return (
    <>
      <FormulaHeader formula={formula} active="propose" />
      <h2 className="text-xl font-semibold">Propose a formula</h2>
      <p className="mb-4 mt-1 max-w-3xl text-sm text-rind-600">
        State what you want from the product; Setwell searches the response surfaces fitted on the trials of {family ? family.name : 'this product'} for the best formula inside what those trials covered, and writes it into this formula’s own lines.
      </p>
      {model && model.responses.length ? (
        <ProposalForm model={model} base={base} formulaId={formula.id} formulaName={formula.name} fruitMinimum={fruitMinimumOf(base)} canCreateTrial={can(actor.role, 'trials.write')} cost={cost} />
      ) : (
        <EmptyState title="No model for this product yet">
          {family ? `Proposals need a model fitted on cooked and tasted trials of ${family.name}.` : 'The formula needs a fruit line before it belongs to a product family.'}
        </EmptyState>
      )}
    </>
  );
}
