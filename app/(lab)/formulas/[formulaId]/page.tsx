import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { getFormula } from '@/lib/formulas/queries';
import { computeFormula } from '@/lib/formulas/compute';
import { listIngredients } from '@/lib/ingredients/queries';
import { editorIngredientOf } from '@/lib/ingredients/schema';
import { FormulaEditor } from '@/components/formulas/FormulaEditor';
import { FormulaHeader } from '@/components/formulas/FormulaHeader';
import { ResultsPanel } from '@/components/formulas/ResultsPanel';
import { FormulaPrintSheet } from '@/components/formulas/FormulaPrintSheet';
import { editorCostBasis } from '@/lib/costs/queries';
import { packFormatOfFormulas } from '@/lib/pricing/queries';
import { editorModels } from '@/lib/modelling/editor-models';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Formula' };

export default async function FormulaPage({ params }: { params: Promise<{ formulaId: string }> }) {
  const actor = await requirePage('formulas.read');
  const writer = can(actor.role, 'formulas.write');
  const formulaId = pageId((await params).formulaId);
  // Every read at once, each on its own forked EntityManager: the formula (a 404 decides the page),
  // and for writers the library, the prices, the formula's pack format and the family models (all
  // workspace-scoped, so a formula of another workspace reveals nothing through them).
  const prices = writer && can(actor.role, 'prices.read');
  const [formula, fullLibrary, costBasis, packFormats, models] = await Promise.all([
    orNotFound(getFormula(actor, formulaId)),
    writer ? listIngredients(actor, { archived: 'include' }) : Promise.resolve([]),
    prices ? editorCostBasis(actor) : Promise.resolve(null),
    prices ? packFormatOfFormulas(actor.workspaceId, [formulaId]) : Promise.resolve(null),
    writer && can(actor.role, 'trials.read') ? editorModels(actor) : Promise.resolve([]),
  ]);
  const c = formula.current;

  if (!writer) {
    // Reviewers read the formula and its results; they cannot save revisions.
    return (
      <>
        <FormulaHeader formula={formula} active="editor" />
        <div className="grid grid-cols-1 gap-6 xl:grid-cols-[minmax(0,1fr)_26rem]">
          <FormulaPrintSheet formula={formula} massUnits={actor.massUnits} temperatureUnit={actor.temperatureUnit} printedAt={new Date().toISOString()} />
          <ResultsPanel outcome={computeFormula(c.settings, c.lines)} massUnits={actor.massUnits} temperatureUnit={actor.temperatureUnit} />
        </div>
      </>
    );
  }

  // Archived ingredients appear only where a current line still uses them (the server refuses them on save).
  const used = new Set(c.lines.map((l) => l.ingredientId));
  const library = fullLibrary.filter((i) => !i.archived || used.has(i.id));
  const cost = costBasis && packFormats ? { basis: costBasis, packFormatId: packFormats.get(formula.id) ?? null } : undefined;
  return (
    <>
      <FormulaHeader formula={formula} active="editor" />
      <FormulaEditor
        mode="revise"
        initial={{
          formulaId: formula.id,
          name: formula.name,
          revision: c.number,
          settings: c.settings,
          lines: c.lines.map((l) => ({ ingredientId: l.ingredientId, quantity: l.quantity, unit: l.unit })),
        }}
        ingredients={library.map(editorIngredientOf)}
        massUnits={actor.massUnits}
        temperatureUnit={actor.temperatureUnit}
        cost={cost}
        models={models}
      />
    </>
  );
}
