import Link from 'next/link';
import { requirePage } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { getIngredient, listIngredients } from '@/lib/ingredients/queries';
import { isUuid } from '@/lib/ids';
import { AccessDenied } from '@/lib/permissions';
import { SavedNotice } from '@/components/ui/SavedNotice';
import { ingredientListQuerySchema } from '@/lib/ingredients/schema';
import { searchText } from '@/lib/input';
import { IngredientTable } from '@/components/ingredients/IngredientTable';
import { IngredientCsvImport } from '@/components/ingredients/IngredientCsvImport';
import { PageHeader } from '@/components/ui/Card';
import { buttonClass } from '@/components/ui/Button';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Ingredients' };

export default async function IngredientsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePage('ingredients.read');
  const raw = await searchParams;
  // An unusable sort or filter in the URL falls back to the default list rather than an error page.
  const parsed = ingredientListQuerySchema.safeParse(raw);
  const query = parsed.success ? parsed.data : { q: searchText.safeParse(raw.q).data || undefined };
  const rows = await listIngredients(actor, query);
  const canEdit = can(actor.role, 'ingredients.write');
  const saved = typeof raw.saved === 'string' && isUuid(raw.saved) ? await savedName(actor, raw.saved) : null;
  return (
    <>
      <PageHeader
        title="Ingredients"
        lead="Your workspace’s library. Handbook typical values are marked with their source; measure your own lots and make the values yours."
        actions={canEdit ? <Link href="/ingredients/new" className={buttonClass('primary')}>Add an ingredient</Link> : null}
      />
      {saved ? <SavedNotice text={`Saved ${saved}.`} /> : null}
      <IngredientTable rows={rows} query={query} canEdit={canEdit} massUnits={actor.massUnits} />
      {canEdit ? <div className="no-print mt-8"><IngredientCsvImport /></div> : null}
    </>
  );
}

/** The name of the ingredient the form just saved; null when the id is not one of this workspace's. */
async function savedName(actor: Parameters<typeof getIngredient>[0], id: string): Promise<string | null> {
  try {
    return (await getIngredient(actor, id)).name;
  } catch (err) {
    if (err instanceof AccessDenied && err.status === 404) return null;
    throw err;
  }
}
