import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getBatchSheet, getSheetVersion } from '@/lib/production/queries';
import { batchSheetQuerySchema } from '@/lib/production/schema';
import { ValidationFailed, zodFieldErrors, type FieldErrors } from '@/lib/errors';
import { safeRecord } from '@/lib/input';
import { ChemistryInputError } from '@/lib/chemistry';
import { Notice } from '@/components/ui/Notice';
import { PrintButton } from '@/components/ui/PrintButton';
import { BatchSheetView } from '@/components/production/BatchSheetView';
import { SheetScaleForm } from '@/components/production/SheetScaleForm';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Batch sheet' };

export default async function BatchSheetPage({ params, searchParams }: { params: Promise<{ versionId: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const actor = await requirePage('production.read');
  const versionId = pageId((await params).versionId);
  const raw = safeRecord(Object.entries(await searchParams).filter((e): e is [string, string] => e[0] !== 'paper' && typeof e[1] === 'string' && e[1] !== ''));
  const paper = (await searchParams).paper === 'letter' ? 'letter' : 'a4';
  const parsed = batchSheetQuerySchema.safeParse(raw);
  let errors: FieldErrors = parsed.success ? {} : zodFieldErrors(parsed.error);
  let sheet = null;
  let problem: string | null = null;
  if (parsed.success) {
    try {
      sheet = await orNotFound(getBatchSheet(actor, versionId, parsed.data));
    } catch (err) {
      // A refused amount names its field; a stored value that needs correcting is said for the whole sheet.
      if (err instanceof ValidationFailed && Object.keys(err.fields).some((f) => f in batchSheetQuerySchema.shape)) errors = err.fields;
      else if (err instanceof ValidationFailed || err instanceof ChemistryInputError) problem = err.message;
      else throw err;
    }
  }
  const version = sheet?.version ?? (await orNotFound(getSheetVersion(actor, versionId)));
  return (
    <>
      <div className="no-print mb-4 space-y-4">
        <p className="text-sm"><Link href={`/production/versions/${version.id}`} className="text-damson-700 underline">Back to {version.product.name} v{version.version}</Link></p>
        <SheetScaleForm values={{ ...raw, paper }} errors={errors} massUnits={actor.massUnits} defaultAltitudeM={version.settings.altitudeM ?? null} />
        {Object.keys(errors).length ? <Notice tone="danger">Some values are not valid: correct them above and the sheet appears.</Notice> : null}
        {problem ? <Notice tone="danger">{problem}</Notice> : null}
        {version.status === 'superseded' ? <Notice tone="warning" title="Superseded version">This sheet is for reference only: make batches to the version in production.</Notice> : null}
        {sheet ? <div className="flex items-center gap-3"><PrintButton label="Print the batch sheet" /><p className="text-sm text-rind-500">Prints on {paper === 'letter' ? 'US Letter' : 'A4'} without the navigation. Use the browser’s “Save as PDF” for a file.</p></div> : null}
      </div>
      {sheet ? <BatchSheetView sheet={sheet.sheet} paper={paper} massUnits={actor.massUnits} temperatures={actor.temperatureUnit === 'C' ? 'metric' : 'imperial'} superseded={version.status === 'superseded'} /> : null}
    </>
  );
}
