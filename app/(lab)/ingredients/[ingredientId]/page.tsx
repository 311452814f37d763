import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getIngredient } from '@/lib/ingredients/queries';
import { IngredientForm } from '@/components/ingredients/IngredientForm';
import { ArchiveIngredientButton } from '@/components/ingredients/ArchiveIngredientButton';
import { PageHeader } from '@/components/ui/Card';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Edit ingredient' };

export default async function EditIngredientPage({ params }: { params: Promise<{ ingredientId: string }> }) {
  const actor = await requirePage('ingredients.write');
  const ingredient = await orNotFound(getIngredient(actor, pageId((await params).ingredientId)));
  return (
    <>
      <PageHeader
        title={ingredient.name}
        lead={ingredient.archived ? 'Archived: old revisions keep it, new lines cannot use it.' : undefined}
        actions={<ArchiveIngredientButton ingredientId={ingredient.id} name={ingredient.name} archived={ingredient.archived} />}
      />
      <IngredientForm initial={ingredient} />
    </>
  );
}
