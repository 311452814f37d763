import { requirePage } from '@/lib/page-guard';
import { IngredientForm } from '@/components/ingredients/IngredientForm';
import { PageHeader } from '@/components/ui/Card';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'New ingredient' };

export default async function NewIngredientPage() {
  await requirePage('ingredients.write');
  return (
    <>
      <PageHeader title="New ingredient" lead="Enter the values you measured or that your supplier’s specification states." />
      <IngredientForm />
    </>
  );
}
