import Link from 'next/link';
import type { BatchView } from '@/lib/production/schema';
import { DISPOSITION_LABELS } from '@/lib/production/vocabulary';
import { formatMass, formatTemperature, type UnitPreference } from '@/lib/chemistry';
import { StatusBadge } from './StatusBadge';
import { formatDate } from '@/lib/format/dates';
import { TableBox } from '@/components/ui/TableBox';

export function BatchTable({ batches, units, temperatures }: { batches: BatchView[]; units: UnitPreference; temperatures: UnitPreference }) {
  if (!batches.length) return <p className="text-sm text-rind-600">No batches recorded yet.</p>;
  return (
    <TableBox label="Batches" framed={false}>
      <table className="w-full text-sm" data-testid="batch-table">
        <thead>
          <tr className="border-b border-pith-300 text-left text-rind-600">
            <th className="py-2 pr-3 font-medium">Lot</th>
            <th className="py-2 pr-3 font-medium">Date</th>
            <th className="py-2 pr-3 font-medium">Version</th>
            <th className="py-2 pr-3 font-medium">Size</th>
            <th className="py-2 pr-3 font-medium">°Brix at 20 °C</th>
            <th className="py-2 pr-3 font-medium">pH</th>
            <th className="py-2 pr-3 font-medium">Fill</th>
            <th className="py-2 pr-3 font-medium">Jars (rejected)</th>
            <th className="py-2 font-medium">Result</th>
          </tr>
        </thead>
        <tbody>
          {batches.map((b) => (
            <tr key={b.id} className="border-b border-pith-200 align-top">
              <td className="py-2 pr-3 font-mono"><Link href={`/production/batches/${b.id}`} className="text-damson-700 underline">{b.lotCode}</Link></td>
              <td className="py-2 pr-3 tabular-nums">{formatDate(b.batchDate)}</td>
              <td className="py-2 pr-3">v{b.version}</td>
              <td className="py-2 pr-3">{formatMass(b.batchSizeG, units)}</td>
              <td className="py-2 pr-3 tabular-nums">{b.brix20.toFixed(1)}</td>
              <td className="py-2 pr-3 tabular-nums">{b.ph.toFixed(2)}</td>
              <td className="py-2 pr-3">{formatTemperature(b.fillTempC, temperatures)}</td>
              <td className="py-2 pr-3 tabular-nums">{b.jarsFilled} ({b.jarsRejected})</td>
              <td className="py-2">
                <div className="flex flex-wrap gap-1">
                  <StatusBadge status={b.status} />
                  {b.status !== 'passed' ? <StatusBadge status={b.latestOutcome} /> : null}
                </div>
                {b.latestOutcome !== 'pass' ? (
                  <div className="mt-1 max-w-xs text-xs text-rind-600">
                    {b.latestChecks.filter((c) => c.status !== 'pass').map((c) => <p key={c.key}>{c.status === 'not_measured' ? `${c.label}: not measured.` : c.reason}</p>)}
                    {b.disposition ? <p className="mt-1 font-medium text-ember-700">{DISPOSITION_LABELS[b.disposition]}: {b.dispositionComment}</p> : null}
                  </div>
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </TableBox>
  );
}
