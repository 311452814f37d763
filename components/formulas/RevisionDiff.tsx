import { formatAltitude, formatMass, formatTemperature, type UnitPreference } from '@/lib/chemistry';
import { diffRevisions, type CompositionChange, type LineDiff, type LineSnapshot, type SettingChange } from '@/lib/formulas/diff';
import { PRODUCT_CLASS_LABELS, RULE_SET_LABELS, type FormulaRevisionView } from '@/lib/formulas/schema';
import { EU_GROUP_LABELS, KIND_LABELS, PECTIN_TYPE_LABELS } from '@/lib/ingredients/schema';
import { TableBox } from '@/components/ui/TableBox';
import { showLineMass } from '@/lib/format/quantities';

/** Stored numbers shown without float noise or padded zeros (10.5, not 10.500000001). */
function decimal(value: number, maxDecimals = 2): string {
  return String(Number(value.toFixed(maxDecimals)));
}

function lookup(labels: Record<string, string>, value: string): string {
  return labels[value] ?? value;
}

function settingValue(change: SettingChange, side: 'before' | 'after', massUnits: UnitPreference, temperatureUnit: 'C' | 'F'): string {
  const value = change[side];
  if (value === null) return '—';
  if (typeof value === 'string') {
    if (change.field === 'productClass') return lookup(PRODUCT_CLASS_LABELS, value);
    if (change.field === 'ruleSet') return lookup(RULE_SET_LABELS, value);
    return value;
  }
  switch (change.field) {
    case 'jarNetFillG':
      return formatMass(value, massUnits, massUnits === 'metric' ? 0 : 1);
    case 'altitudeM':
      return formatAltitude(value, massUnits);
    case 'measuredWaterBoilingC':
      return formatTemperature(value, temperatureUnit === 'C' ? 'metric' : 'imperial');
    case 'targetSolidsPct':
      return `${decimal(value, 1)} %`;
    default:
      return decimal(value);
  }
}

function describeComposition(change: CompositionChange, side: 'before' | 'after'): string {
  const value = change[side];
  if (value === null) return '—';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'number') return change.field === 'solidsPct' || change.field === 'acidPct' ? `${decimal(value)} %` : decimal(value);
  if (change.field === 'kind') return lookup(KIND_LABELS, value);
  if (change.field === 'pectinType') return lookup(PECTIN_TYPE_LABELS, value);
  if (change.field === 'euFruitGroup') return lookup(EU_GROUP_LABELS, value);
  if (change.field === 'usFruitGroup') return value === '1' ? 'Group I' : value === '2' ? 'Group II' : value;
  return value.replaceAll('_', ' ');
}

function quantityText(line: LineSnapshot, massUnits: UnitPreference): string {
  return line.unit === 'pct_fruit' ? `${decimal(line.quantity)} % of fruit` : showLineMass(line.quantity, massUnits);
}

const CHANGED_CELL = 'bg-quince-100 font-semibold text-rind-900';

const ROW_STYLES: Record<LineDiff['status'], string> = {
  added: 'bg-leaf-50 text-leaf-700',
  removed: 'bg-ember-50 text-ember-700 line-through decoration-ember-600',
  changed: '',
  unchanged: 'text-rind-600',
};

const STATUS_LABELS: Record<LineDiff['status'], string> = {
  added: 'Added',
  removed: 'Removed',
  changed: 'Changed',
  unchanged: 'Unchanged',
};

const STATUS_BADGES: Record<LineDiff['status'], string> = {
  added: 'bg-leaf-100 text-leaf-700',
  removed: 'bg-ember-100 text-ember-700',
  changed: 'bg-quince-100 text-quince-700',
  unchanged: 'bg-pith-200 text-rind-600',
};

function SnapshotCells({ line, side, massUnits }: { line: LineDiff; side: 'before' | 'after'; massUnits: UnitPreference }) {
  const snap = line[side];
  if (!snap) {
    return (
      <>
        <td className="px-3 py-2 text-rind-400">—</td>
        <td className="px-3 py-2 text-rind-400">—</td>
      </>
    );
  }
  // Only the newer side is highlighted, so the eye lands on the value that is now in force.
  const highlight = side === 'after' && line.status === 'changed';
  const quantityChanged = highlight && (line.changes.includes('quantity') || line.changes.includes('unit'));
  const solidsChanged = highlight && line.changes.includes('ingredient.solidsPct');
  return (
    <>
      <td className={`px-3 py-2 tabular-nums ${quantityChanged ? CHANGED_CELL : ''}`} data-changed={quantityChanged || undefined}>
        {quantityText(snap, massUnits)}
      </td>
      <td className={`px-3 py-2 tabular-nums ${solidsChanged ? CHANGED_CELL : ''}`} data-changed={solidsChanged || undefined}>
        {decimal(snap.solidsPct)} %
      </td>
    </>
  );
}

/** Side-by-side comparison of two revisions of a formula: settings first, then the lines. */
export function RevisionDiff({
  before,
  after,
  massUnits,
  temperatureUnit = 'C',
  title,
  sideLabels,
}: {
  before: FormulaRevisionView;
  after: FormulaRevisionView;
  massUnits: UnitPreference;
  temperatureUnit?: 'C' | 'F';
  /** Overrides the "Revision 1 → revision 2" heading, e.g. when comparing trial variants. */
  title?: string;
  /** Names the two sides where they are not revisions of one formula (e.g. "v2 in production", "this request"). */
  sideLabels?: { before: string; after: string };
}) {
  const diff = diffRevisions(before, after);
  const heading = title ?? `Revision ${diff.beforeRevision} → revision ${diff.afterRevision}`;
  const side = sideLabels ?? { before: `rev. ${diff.beforeRevision}`, after: `rev. ${diff.afterRevision}` };
  const sideTitle = sideLabels ?? { before: `Revision ${diff.beforeRevision}`, after: `Revision ${diff.afterRevision}` };

  if (diff.identical) {
    return (
      <section aria-label={heading} className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
        <h2 className="font-display text-lg text-damson-900">{heading}</h2>
        <p className="mt-2 text-rind-600">No differences. Name, settings, lines and ingredient values are the same in both {sideLabels ? 'formulas' : 'revisions'}.</p>
      </section>
    );
  }

  const visibleLineChanges = diff.lines.filter((l) => l.status !== 'unchanged').length;

  return (
    <section aria-label={heading} className="space-y-5">
      <h2 className="font-display text-lg text-damson-900">{heading}</h2>

      {diff.name ? (
        <p className="text-sm">
          <span className="font-medium">Name: </span>
          <del className="text-ember-700">{diff.name.before}</del>
          <span aria-hidden="true"> → </span>
          <ins className="bg-quince-100 font-semibold no-underline">{diff.name.after}</ins>
        </p>
      ) : null}

      {diff.settings.length ? (
        <TableBox label="Settings changed">
          <table className="min-w-full divide-y divide-pith-300 bg-pith-50 text-sm">
            <caption className="px-4 py-2 text-left font-semibold text-rind-700">Settings that changed</caption>
            <thead className="bg-pith-200 text-left text-xs uppercase tracking-wider text-rind-600">
              <tr>
                <th scope="col" className="px-3 py-2">Setting</th>
                <th scope="col" className="px-3 py-2">{sideTitle.before}</th>
                <th scope="col" className="px-3 py-2">{sideTitle.after}</th>
              </tr>
            </thead>
            <tbody className="divide-y divide-pith-200">
              {diff.settings.map((change) => (
                <tr key={change.field}>
                  <th scope="row" className="px-3 py-2 text-left font-medium">{change.label}</th>
                  <td className="px-3 py-2 text-rind-600">{settingValue(change, 'before', massUnits, temperatureUnit)}</td>
                  <td className={`px-3 py-2 ${CHANGED_CELL}`} data-changed>{settingValue(change, 'after', massUnits, temperatureUnit)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableBox>
      ) : (
        <p className="text-sm text-rind-600">Settings are unchanged.</p>
      )}

      <TableBox label="Lines changed">
        <table className="min-w-full divide-y divide-pith-300 bg-pith-50 text-sm">
          <caption className="px-4 py-2 text-left font-semibold text-rind-700">
            Lines {visibleLineChanges ? `(${visibleLineChanges} changed, added or removed)` : '(unchanged)'}
          </caption>
          <thead className="bg-pith-200 text-left text-xs uppercase tracking-wider text-rind-600">
            <tr>
              <th scope="col" className="px-3 py-2">Ingredient</th>
              <th scope="col" className="px-3 py-2">Status</th>
              <th scope="col" className="px-3 py-2">Quantity, {side.before}</th>
              <th scope="col" className="px-3 py-2">Solids, {side.before}</th>
              <th scope="col" className="px-3 py-2">Quantity, {side.after}</th>
              <th scope="col" className="px-3 py-2">Solids, {side.after}</th>
              <th scope="col" className="px-3 py-2">Ingredient values changed</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-pith-200">
            {diff.lines.map((line, i) => (
              <tr key={`${line.ingredientId}-${i}`} className={ROW_STYLES[line.status]} data-status={line.status}>
                <th scope="row" className="px-3 py-2 text-left font-medium">{line.ingredientName}</th>
                <td className="px-3 py-2">
                  <span className={`inline-block rounded-full px-2 py-0.5 text-xs font-semibold ${STATUS_BADGES[line.status]}`}>{STATUS_LABELS[line.status]}</span>
                </td>
                <SnapshotCells line={line} side="before" massUnits={massUnits} />
                <SnapshotCells line={line} side="after" massUnits={massUnits} />
                <td className="px-3 py-2 text-xs">
                  {line.compositionChanges.length ? (
                    <ul className="space-y-0.5">
                      {line.compositionChanges.map((c) => (
                        <li key={c.field}>
                          {c.label}: {describeComposition(c, 'before')} → <span className="font-semibold">{describeComposition(c, 'after')}</span>
                        </li>
                      ))}
                    </ul>
                  ) : (
                    <span className="text-rind-400">—</span>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableBox>
    </section>
  );
}
