import { requirePage } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { listAttributes } from '@/lib/tastings/queries';
import { PageHeader } from '@/components/ui/Card';
import { scaleNote } from '@/lib/sensory/scales';
import { AttributeForm } from '@/components/tastings/AttributeForm';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Tasting attributes' };

export default async function AttributesPage() {
  const actor = await requirePage('tastings.read');
  const attributes = await listAttributes(actor);
  return (
    <>
      <PageHeader title="Tasting attributes" lead="What tasters rate, each with its scale and the instruction they read on their phone." />
      <ul className="mb-8 grid gap-3 md:grid-cols-2" data-testid="attribute-list">
        {attributes.map((a) => (
          <li key={a.id} className="rounded-card bg-pith-50 p-4 ring-1 ring-pith-300">
            <p className="font-medium">{a.name} <span className="text-xs text-rind-500">{[scaleNote(a.name, a.scaleName), a.libraryKey ? null : 'your own'].filter(Boolean).map((t) => ` · ${t}`).join('')}</span></p>
            <p className="mt-1 text-sm text-rind-600">{a.instruction}</p>
          </li>
        ))}
      </ul>
      {can(actor.role, 'tastings.run') ? <AttributeForm /> : null}
    </>
  );
}
