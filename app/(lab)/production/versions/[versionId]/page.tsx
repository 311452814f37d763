import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { getProductionVersion } from '@/lib/production/queries';
import { formatMass, formatTemperature, qcSpecCautions } from '@/lib/chemistry';
import { PRODUCT_CLASS_LABELS, RULE_SET_LABELS } from '@/lib/formulas/schema';
import { PageHeader, Card } from '@/components/ui/Card';
import { Notice } from '@/components/ui/Notice';
import { buttonClass } from '@/components/ui/Button';
import { StatusBadge } from '@/components/production/StatusBadge';
import { SpecTable } from '@/components/production/SpecTable';
import { CautionList } from '@/components/ui/CautionList';
import { AuditTrail } from '@/components/production/AuditTrail';
import { BatchTable } from '@/components/production/BatchTable';
import { formatDate } from '@/lib/format/dates';
import { TableBox } from '@/components/ui/TableBox';
import { versionLabel } from '@/lib/label/queries';
import { LabelPanel } from '@/components/label/LabelPanel';
import { KEPT_NOTES, LabelExportLinks } from '@/components/label/LabelPageBody';
import { PackFormatPicker } from '@/components/pricing/PackFormatPicker';
import { packFormatList, packFormatOfVersions } from '@/lib/pricing/queries';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Production version' };

export default async function VersionPage({ params }: { params: Promise<{ versionId: string }> }) {
  const actor = await requirePage('production.read');
  const v = await orNotFound(getProductionVersion(actor, pageId((await params).versionId)));
  const label = await versionLabel(actor, v.id);
  // The pack format is the one thing of a version that may change after approval (audited); prices follow their permission.
  const pack = can(actor.role, 'prices.read')
    ? { current: (await packFormatOfVersions(actor.workspaceId, [v.id])).get(v.id) ?? null, formats: (await packFormatList(actor)).map((f) => ({ id: f.id, name: f.name })) }
    : null;
  const units = actor.massUnits;
  const temps = actor.temperatureUnit === 'C' ? 'metric' : 'imperial';
  return (
    <>
      <PageHeader
        title={`${v.product.name} v${v.version}`}
        lead={`${PRODUCT_CLASS_LABELS[v.settings.productClass]}, ${RULE_SET_LABELS[v.settings.ruleSet]} rules. From ${v.source.trialCode} “${v.trialTitle}” variant ${v.source.variantLabel}; approved by ${v.approvedBy} on ${formatDate(v.approvedAt)}.`}
        actions={<StatusBadge status={v.status} />}
      />
      <p className="-mt-3 mb-6 flex flex-wrap gap-3 text-sm">
        <Link href={`/production/products/${v.product.id}`} className="text-damson-700 underline">All versions and trends</Link>
        {can(actor.role, 'promotion.read') ? <Link href={`/production/reviews/${v.promotionRequestId}`} className="text-damson-700 underline">The request and its evidence</Link> : null}
      </p>
      {v.status === 'superseded' ? (
        <div className="mb-6"><Notice tone="warning" title={`Superseded by v${v.supersededByVersion} on ${formatDate(v.supersededAt)}`}>Kept read-only with its history. Make new batches to the version in production.</Notice></div>
      ) : (
        <div className="no-print mb-6 flex flex-wrap gap-2">
          <Link href={`/production/versions/${v.id}/sheet`} className={buttonClass('secondary')}>Batch sheet</Link>
          {can(actor.role, 'batches.record') ? <Link href={`/production/versions/${v.id}/batches/new`} className={buttonClass('primary')}>Record a batch</Link> : null}
        </div>
      )}
      <p className="mb-4 text-sm text-rind-600">An approved version is a fixed record: nobody can edit or delete it (only the pack format it is costed in may change, and that is recorded). To change the product, run a trial and promote a new version.</p>
      {pack ? (
        <div className="no-print mb-6">
          {can(actor.role, 'prices.write') ? (
            <PackFormatPicker subject="version" subjectId={v.id} current={pack.current} formats={pack.formats} />
          ) : (
            <p className="text-sm">Pack format: {pack.formats.find((f) => f.id === pack.current)?.name ?? 'none chosen'}</p>
          )}
        </div>
      ) : null}
      <div className="grid gap-6 lg:grid-cols-2">
        <Card title="Formula as approved">
          <TableBox label="Formula lines" framed={false}>
            <table className="w-full text-sm">
              <thead><tr className="border-b border-pith-300 text-left text-rind-600"><th className="py-1 pr-3 font-medium">Ingredient</th><th className="py-1 font-medium">Quantity</th></tr></thead>
              <tbody>{v.lines.map((l, i) => <tr key={i} className="border-b border-pith-200"><td className="py-1 pr-3">{l.ingredient.name}</td><td className="py-1 tabular-nums">{l.unit === 'pct_fruit' ? `${l.quantity} % of fruit` : formatMass(l.quantity, units, 1)}</td></tr>)}</tbody>
            </table>
          </TableBox>
          <p className="mt-3 text-sm text-rind-600">Target {v.settings.targetSolidsPct} % solids; {v.settings.jarNetFillG} g jars. End point {formatTemperature(v.process.endPointSeaLevelC, temps)} at sea level; fill at {formatTemperature(v.process.fillTempC, temps)}.</p>
          {v.process.cookNotes ? <p className="mt-2 whitespace-pre-line text-sm">{v.process.cookNotes}</p> : null}
          <p className="mt-3 text-sm"><strong>{v.compliance.edition}:</strong> {v.compliance.overall.replace('_', ' ')} at approval.</p>
        </Card>
        <Card title="QC specification">
          <SpecTable spec={v.spec} temperatures={temps} />
          <div className="mt-3"><CautionList cautions={qcSpecCautions(v.spec, v.settings.productClass, v.settings.preservation ?? undefined)} /></div>
        </Card>
      </div>
      <div className="mt-6" id="label">
        <Card title={label.kept === 'frozen' ? 'Label, frozen at approval' : 'Label, not frozen at approval'} actions={<Link href={`/production/versions/${v.id}/label`} className="no-print text-sm text-damson-700 underline">Print view</Link>}>
          <p className="mb-3 text-sm text-rind-600">{KEPT_NOTES[label.kept]}</p>
          <div className="no-print mb-4"><LabelExportLinks apiPath={`/api/v1/production-versions/${v.id}/label`} fileName={`label-${v.product.code.toLowerCase()}-v${v.version}`} /></div>
          {label.label ? <LabelPanel label={label.label} heading={`Label of ${label.subject.name}`} /> : <Notice tone="warning" title="No label">{label.problem}</Notice>}
        </Card>
      </div>
      <div className="mt-6" id="batches"><Card title="Batches made to this version"><BatchTable batches={[...v.batches].reverse()} units={units} temperatures={temps} /></Card></div>
      <div className="mt-6"><Card title="Audit trail"><AuditTrail events={v.audit} /></Card></div>
    </>
  );
}
