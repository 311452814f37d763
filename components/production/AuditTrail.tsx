import type { AuditView } from '@/lib/production/schema';
import { ROLE_LABELS, type Role } from '@/lib/permissions';
import { formatDateTime } from '@/lib/format/dates';
import { TableBox } from '@/components/ui/TableBox';

/** The insert-only trail: who, what, when, and from which request. */
export function AuditTrail({ events, showRequest = false }: { events: AuditView[]; showRequest?: boolean }) {
  if (!events.length) return <p className="text-sm text-rind-600">Nothing recorded yet.</p>;
  return (
    <TableBox label="Audit trail" framed={false}>
      <table className="w-full text-sm" data-testid="audit-trail">
        <thead>
          <tr className="border-b border-pith-300 text-left text-rind-600">
            <th className="py-2 pr-3 font-medium">When</th>
            <th className="py-2 pr-3 font-medium">Who</th>
            <th className="py-2 pr-3 font-medium">What</th>
            {showRequest ? <th className="py-2 font-medium">Request</th> : null}
          </tr>
        </thead>
        <tbody>
          {events.map((e) => (
            <tr key={e.id} className="border-b border-pith-200 align-top">
              <td className="whitespace-nowrap py-2 pr-3 tabular-nums">{formatDateTime(e.at)}</td>
              <td className="py-2 pr-3">{e.actorName}<span className="block text-xs text-rind-500">{ROLE_LABELS[e.actorRole as Role] ?? e.actorRole}</span></td>
              <td className="py-2 pr-3">{e.summary}</td>
              {showRequest ? <td className="py-2">{e.promotionRequestId ? <a className="text-damson-700 underline" href={`/production/reviews/${e.promotionRequestId}`}>open</a> : '—'}</td> : null}
            </tr>
          ))}
        </tbody>
      </table>
    </TableBox>
  );
}
