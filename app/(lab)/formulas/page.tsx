import Link from 'next/link';
import { requirePage } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { listFormulas } from '@/lib/formulas/queries';
import { formulaListQuerySchema } from '@/lib/formulas/schema';
import { FormulaList } from '@/components/formulas/FormulaList';
import { PageHeader } from '@/components/ui/Card';
import { buttonClass } from '@/components/ui/Button';
import { inputClass } from '@/components/ui/Field';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Formulas' };

export default async function FormulasPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePage('formulas.read');
  // A search the server cannot take (control characters, too long, repeated) is shown as no search.
  const q = formulaListQuerySchema.safeParse(await searchParams).data?.q;
  const formulas = await listFormulas(actor, { q });
  const canCreate = can(actor.role, 'formulas.write');
  return (
    <>
      <PageHeader
        title="Formulas"
        lead="Every save is a revision you can compare and print."
        actions={canCreate ? <Link href="/formulas/new" className={buttonClass('primary')}>New formula</Link> : null}
      />
      <form method="get" className="mb-6 flex max-w-md gap-2" role="search">
        <label htmlFor="formula-search" className="sr-only">Search formulas</label>
        <input id="formula-search" name="q" defaultValue={q} placeholder="Search by name" className={inputClass} />
        <button type="submit" className={buttonClass('secondary')}>Search</button>
      </form>
      <FormulaList formulas={formulas} massUnits={actor.massUnits} canCreate={canCreate} query={q} />
    </>
  );
}
