/** What a new version changes on the pack: the verdict and the rows whose text differs, printed or a check behind the pack. */
import type { LabelComparison } from '@/lib/label/schema';
import { labelChangeVerdict } from '@/lib/production/review';
import { Notice } from '@/components/ui/Notice';
import { TableBox } from '@/components/ui/TableBox';

export function LabelChanges({ comparison }: { comparison: LabelComparison }) {
  const { changes, baselineVersion, baselineKept, problem } = comparison;
  if (problem) return <Notice tone="warning" title="The labels cannot be compared">{problem}</Notice>;
  return (
    <div className="space-y-3">
      <Notice tone={changes.some((c) => c.printed) ? 'warning' : changes.length ? 'info' : 'success'} title={labelChangeVerdict(changes, baselineVersion)}>
        {baselineKept === 'not_frozen'
          ? `Version ${baselineVersion}'s label was not frozen at approval; it is computed from today's ingredient data.`
          : `Compared with the label frozen when version ${baselineVersion} was approved.`}
      </Notice>
      {changes.length ? (
        <TableBox label="Label rows that change" framed={false}>
          <table className="w-full text-sm">
            <thead><tr className="border-b border-pith-300 text-left text-rind-600"><th scope="col" className="py-1 pr-3 font-medium">Part</th><th scope="col" className="py-1 pr-3 font-medium">Row</th><th scope="col" className="py-1 pr-3 font-medium">Version {baselineVersion}</th><th scope="col" className="py-1 pr-3 font-medium">Proposed</th></tr></thead>
            <tbody>{changes.map((c) => (
              <tr key={`${c.section}|${c.item}|${c.before}`} className="border-b border-pith-200 align-top">
                <td className="py-1 pr-3 text-rind-600">{c.section}{c.printed ? null : <span className="block text-xs">not printed on the pack</span>}</td>
                <th scope="row" className="py-1 pr-3 text-left font-normal">{c.item}</th>
                <td className="py-1 pr-3">{c.before ?? 'not on the label'}</td>
                <td className="py-1 pr-3 font-medium">{c.after ?? 'not on the label'}</td>
              </tr>
            ))}</tbody>
          </table>
        </TableBox>
      ) : null}
    </div>
  );
}
