import { formatTemperature, type QcSpec, type UnitPreference } from '@/lib/chemistry';
import { TableBox } from '@/components/ui/TableBox';

/** The QC targets of a production version, as the kitchen reads them. */
export function SpecTable({ spec, temperatures }: { spec: QcSpec; temperatures: UnitPreference }) {
  const rows: Array<[string, string]> = [
    ['Soluble solids (refractometer, corrected to 20 °C)', `${spec.solidsMinBrix.toFixed(1)}–${spec.solidsMaxBrix.toFixed(1)} °Brix`],
    ['pH', `${spec.phMin.toFixed(2)}–${spec.phMax.toFixed(2)}`],
    ['Minimum fill temperature', formatTemperature(spec.minFillTempC, temperatures)],
    ['Net fill', `${spec.netFillG.toFixed(0)} g, tolerance ${spec.netFillToleranceG.toFixed(1)} g per jar (mean at least the declared fill)`],
    ['Expected set', `Score ${spec.setMinScore} or more: ${spec.setDescription}`],
    ['Shelf life (unopened)', `${spec.shelfLifeMonths} months`],
    ['Storage', spec.storageNotes],
  ];
  return (
    <TableBox label="QC specification" framed={false}>
      <table className="w-full text-sm" data-testid="qc-spec">
        <tbody>
          {rows.map(([k, v]) => (
            <tr key={k} className="border-b border-pith-200 last:border-0">
              <th scope="row" className="py-1.5 pr-4 text-left font-medium text-rind-600">{k}</th>
              <td className="py-1.5">{v}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </TableBox>
  );
}
