import Link from 'next/link';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { getPromotionRequest } from '@/lib/production/queries';
import { formatMass, formatTemperature, OVERALL_STATUS_LABELS, qcSpecCautions } from '@/lib/chemistry';
import { FACTOR_LABELS, type TrialFactor } from '@/lib/trials/vocabulary';
import { PageHeader, Card } from '@/components/ui/Card';
import { Notice } from '@/components/ui/Notice';
import { StatusBadge } from '@/components/production/StatusBadge';
import { SpecTable } from '@/components/production/SpecTable';
import { CautionList } from '@/components/ui/CautionList';
import { AuditTrail } from '@/components/production/AuditTrail';
import { DecisionForm } from '@/components/production/DecisionForm';
import { approvalConsequence, predictedEndPointText } from '@/lib/production/review';
import { PromotionFormula } from '@/components/production/PromotionFormula';
import { WithdrawButton } from '@/components/production/WithdrawButton';
import { formatDate } from '@/lib/format/dates';
import { promotionLabelComparison } from '@/lib/label/queries';
import { LabelChanges } from '@/components/label/LabelChanges';
import { LabReadings } from '@/components/production/LabReadings';
import type { OverallComplianceStatus } from '@/lib/chemistry';
import { sentence } from '@/lib/format/words';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Promotion request' };

const n = (x: number | null, d: number) => (x === null ? '—' : x.toFixed(d));

export default async function PromotionRequestPage({ params }: { params: Promise<{ requestId: string }> }) {
  const actor = await requirePage('promotion.read');
  const r = await orNotFound(getPromotionRequest(actor, pageId((await params).requestId)));
  const labelComparison = await promotionLabelComparison(actor, r);
  const units = actor.massUnits;
  const temps = actor.temperatureUnit === 'C' ? 'metric' : 'imperial';
  const e = r.evidence;
  const attributes = [...new Set(e.means.map((m) => m.attribute))];
  const labels = [...new Set(e.means.map((m) => m.label))].sort();
  return (
    <>
      <PageHeader
        title={`${r.code}: variant ${r.variantLabel} of ${r.trial.code}`}
        lead={`${sentence(r.productLabel)} Requested by ${r.requestedBy} on ${formatDate(r.requestedAt)}.${r.status === 'pending' ? ` On approval, ${approvalConsequence(r.outcome).replace(/^T/, 't')}` : ''}`}
        actions={<StatusBadge status={r.status} />}
      />
      <p className="-mt-3 mb-6 text-sm">
        <Link href={`/trials/${r.trial.id}/compare`} className="text-damson-700 underline">Live comparison of {r.trial.code}</Link>
        {r.productVersionId ? <> · <Link href={`/production/versions/${r.productVersionId}`} className="text-damson-700 underline">The production version it created</Link></> : null}
      </p>
      {r.status !== 'pending' ? (
        <div className="mb-6">
          <Notice tone={r.status === 'approved' ? 'success' : 'warning'} title={`${r.status === 'approved' ? 'Approved' : r.status === 'withdrawn' ? 'Withdrawn' : 'Sent back'} by ${r.decidedBy} on ${formatDate(r.decidedAt)}`}>
            <span className="whitespace-pre-line">{r.decisionComment ?? 'No comment.'}</span>
          </Notice>
        </div>
      ) : null}

      <div className="grid gap-6 lg:grid-cols-3">
        {/* min-w-0: a grid column would otherwise grow to its widest table and push the page sideways on a phone. */}
        <div className="min-w-0 space-y-6 lg:col-span-2">
          <Card title="Why">
            {r.previousRequest ? (
              <p className="mb-3 rounded-lg bg-pith-100 px-3 py-2 text-sm" data-testid="resubmitted-after">
                <strong>Re-submitted after:</strong> <span className="whitespace-pre-line">{r.previousRequest.sentBackBecause || 'no reason given'}</span>{' '}
                (<Link href={`/production/reviews/${r.previousRequest.id}`} className="text-damson-700 underline">{r.previousRequest.code}, sent back</Link>)
              </p>
            ) : null}
            <p className="whitespace-pre-line">{r.rationale}</p>
            <p className="mt-3 text-sm text-rind-600"><strong>Trial question:</strong> {e.trial.question}</p>
            <p className="mt-1 text-sm text-rind-600"><strong>Variant:</strong> {e.variant.description}{e.variant.factorLevels.length ? ` (${e.variant.factorLevels.map((l) => `${FACTOR_LABELS[l.factor as TrialFactor]?.name ?? l.factor} ${Number(l.value.toFixed(3))}`).join(', ')})` : ''}</p>
          </Card>
          <Card title="Formula">
            <PromotionFormula formula={r.formula} baseline={r.baseline} variantLabel={r.variantLabel} massUnits={units} temperatureUnit={actor.temperatureUnit} />
          </Card>
          {labelComparison ? (
            <Card title={`Label against v${labelComparison.baselineVersion}`}>
              <LabelChanges comparison={labelComparison} />
            </Card>
          ) : null}
          <Card title="Compliance and predicted chemistry">
            <p className="text-sm"><strong>{e.compliance.edition}:</strong> {OVERALL_STATUS_LABELS[e.compliance.overall as OverallComplianceStatus] ?? e.compliance.overall}</p>
            {e.compliance.failing.length ? <ul className="mt-1 list-disc pl-5 text-sm text-ember-700">{e.compliance.failing.map((f) => <li key={f}>{f}</li>)}</ul> : null}
            <p className="mt-2 text-sm text-rind-600">Target {e.predicted.targetSolidsPct.toFixed(1)} % solids, planned pH {n(e.predicted.plannedPh, 2)}, predicted end point {predictedEndPointText(e.predicted, (c) => formatTemperature(c, temps))}, about {formatMass(e.predicted.finishedMassG, units)} per batch, estimated aw {e.predicted.aw.toFixed(3)}.</p>
            {e.cautions.filter((c) => c.severity !== 'info').length ? (
              <ul className="mt-2 list-disc pl-5 text-sm">{e.cautions.filter((c) => c.severity !== 'info').map((c) => <li key={c.code}><span className={c.severity === 'danger' ? 'text-ember-700' : 'text-amberline-700'}>{c.title}</span></li>)}</ul>
            ) : null}
          </Card>
          <Card title="What tasters said">
            {e.verdicts.length === 0 ? <p className="text-sm text-rind-600">No tasting with answers was attached.</p> : (
              <ul className="space-y-1 text-sm" data-testid="evidence-verdicts">{e.verdicts.map((v, i) => <li key={i}><strong>{v.session}</strong> — {v.attribute}: {v.verdict}</li>)}</ul>
            )}
            {attributes.length ? (
              <div className="mt-4 overflow-x-auto">
                <table className="w-full text-sm">
                  <thead><tr className="border-b border-pith-300 text-left text-rind-600"><th className="py-1 pr-3 font-medium">Attribute</th>{labels.map((l) => <th key={l} className={`py-1 pr-3 font-medium ${l === r.variantLabel ? 'text-damson-800' : ''}`}>{l}</th>)}</tr></thead>
                  <tbody>{attributes.map((a) => (
                    <tr key={a} className="border-b border-pith-200"><th scope="row" className="py-1 pr-3 text-left font-normal">{a}</th>{labels.map((l) => <td key={l} className={`py-1 pr-3 tabular-nums ${l === r.variantLabel ? 'font-semibold' : ''}`}>{n(e.means.find((m) => m.attribute === a && m.label === l)?.mean ?? null, 2)}</td>)}</tr>
                  ))}</tbody>
                </table>
              </div>
            ) : null}
          </Card>
          <Card title="Lab readings">
            <LabReadings lab={e.lab} variantLabel={r.variantLabel} temperatures={temps} />
          </Card>
        </div>
        <div className="min-w-0 space-y-6">
          {r.canDecide ? <DecisionForm requestId={r.id} code={r.code} outcome={r.outcome} /> : null}
          {r.awaitsAnotherDecider ? (
            <Notice tone="info">You made this request: another head of product must decide it.</Notice>
          ) : null}
          {r.canWithdraw ? <WithdrawButton requestId={r.id} code={r.code} /> : null}
          <Card title="Process">
            <p className="text-sm">End point {formatTemperature(r.process.endPointSeaLevelC, temps)} at sea level; fill at {formatTemperature(r.process.fillTempC, temps)}.</p>
            {r.process.cookNotes ? <p className="mt-2 whitespace-pre-line text-sm text-rind-600">{r.process.cookNotes}</p> : null}
          </Card>
          <Card title="Proposed QC specification">
            <SpecTable spec={r.spec} temperatures={temps} />
            <div className="mt-3"><CautionList cautions={qcSpecCautions(r.spec, e.predicted.productClass, e.predicted.preservation ?? undefined)} /></div>
          </Card>
          {r.history.length ? (
            <Card title="Earlier requests for this trial">
              <ul className="space-y-1 text-sm">{r.history.map((h) => <li key={h.id}><Link href={`/production/reviews/${h.id}`} className="text-damson-700 underline">{h.code}</Link> variant {h.variantLabel} — <StatusBadge status={h.status} /></li>)}</ul>
            </Card>
          ) : null}
        </div>
      </div>
      <div className="mt-6"><Card title="Audit trail"><AuditTrail events={r.audit} /></Card></div>
    </>
  );
}
