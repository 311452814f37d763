import { requirePage } from '@/lib/page-guard';
import { listIngredients } from '@/lib/ingredients/queries';
import { editorIngredientOf } from '@/lib/ingredients/schema';
import { FormulaEditor } from '@/components/formulas/FormulaEditor';
import { PageHeader } from '@/components/ui/Card';
import { todayIso } from '@/lib/format/dates';
import { can } from '@/lib/permissions';
import { editorModels } from '@/lib/modelling/editor-models';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'New formula' };

export default async function NewFormulaPage() {
  const actor = await requirePage('formulas.write');
  const [ingredients, models] = await Promise.all([listIngredients(actor), can(actor.role, 'trials.read') ? editorModels(actor) : Promise.resolve([])]);
  return (
    <>
      <PageHeader title="New formula" lead="Pick ingredients from your library; the results update as you type. Saving creates revision 1." />
      <FormulaEditor
        mode="create"
        ingredients={ingredients.map(editorIngredientOf)}
        massUnits={actor.massUnits}
        temperatureUnit={actor.temperatureUnit}
        defaults={{ ruleDate: todayIso(), targetSolidsPct: 65, jarNetFillG: 340 }}
        models={models}
      />
    </>
  );
}
