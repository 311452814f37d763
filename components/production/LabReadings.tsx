import { formatTemperature } from '@/lib/chemistry';
import { formatDate } from '@/lib/format/dates';
import type { PromotionEvidence } from '@/lib/production/schema';
import { Notice } from '@/components/ui/Notice';

const n = (x: number | null, d: number) => (x === null ? '—' : x.toFixed(d));

/**
 * The trial's cooks on the review page, the promoted variant's in bold. When that variant was never
 * cooked it says so first: the other variants' readings are not evidence for it.
 */
export function LabReadings({ lab, variantLabel, temperatures }: { lab: PromotionEvidence['lab']; variantLabel: string; temperatures: Parameters<typeof formatTemperature>[1] }) {
  if (lab.length === 0) return <p className="text-sm text-rind-600">No cooks were recorded.</p>;
  return (
    <>
      {!lab.some((m) => m.label === variantLabel) ? (
        <div className="mb-3"><Notice tone="warning">Variant {variantLabel} was never cooked in this trial: the readings below are of the other variants, not of the one to approve.</Notice></div>
      ) : null}
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <thead><tr className="border-b border-pith-300 text-left text-rind-600"><th className="py-1 pr-3 font-medium">Variant</th><th className="py-1 pr-3 font-medium">Cooked</th><th className="py-1 pr-3 font-medium">°Brix at 20 °C</th><th className="py-1 pr-3 font-medium">pH</th><th className="py-1 pr-3 font-medium">End point</th><th className="py-1 font-medium">Set</th></tr></thead>
          <tbody>{lab.map((m, i) => (
            <tr key={i} className={`border-b border-pith-200 ${m.label === variantLabel ? 'font-semibold' : ''}`}><td className="py-1 pr-3">{m.label}</td><td className="py-1 pr-3">{formatDate(m.cookDate)}</td><td className="py-1 pr-3 tabular-nums">{n(m.brix20, 1)}</td><td className="py-1 pr-3 tabular-nums">{n(m.ph, 2)}</td><td className="py-1 pr-3">{m.endPointTempC === null ? '—' : formatTemperature(m.endPointTempC, temperatures)}</td><td className="py-1">{m.setTestScore ?? '—'}</td></tr>
          ))}</tbody>
        </table>
      </div>
    </>
  );
}
