/**
 * The label page of a formula, variant or version: how the label was kept, the claim reference
 * (live labels only), print and export, then the panel. A server component; the reference picker
 * is a plain GET form, so it works without scripts.
 */
import type { LabelView } from '@/lib/label/schema';
import { Notice } from '@/components/ui/Notice';
import { PrintButton } from '@/components/ui/PrintButton';
import { SelectField } from '@/components/ui/Field';
import { Button } from '@/components/ui/Button';
import { LabelPanel } from './LabelPanel';
import { RULE_SET_LABELS } from '@/lib/formulas/schema';
import { formatDate, formatDateTime } from '@/lib/format/dates';

export const KEPT_NOTES: Record<LabelView['kept'], string> = {
  live: 'Computed now from the latest lines and the ingredient library; it changes when either does.',
  frozen: 'Frozen when this version was approved: later changes to the ingredient library do not change it.',
  not_frozen: 'This version was approved before labels were frozen, so its label was not frozen at approval: it is computed now from today’s ingredient data.',
};

export function LabelExportLinks({ apiPath, fileName }: { apiPath: string; fileName: string }) {
  return (
    <p className="flex flex-wrap gap-3 text-sm">
      <a href={`${apiPath}?format=csv`} download={`${fileName}.csv`} className="text-damson-700 underline">Download CSV</a>
      <a href={`${apiPath}?format=json`} download={`${fileName}.json`} className="text-damson-700 underline">Download JSON</a>
    </p>
  );
}

/**
 * On paper only (the screen has the page's own header): what the label is of, which revision or
 * version, the rules it was checked against, and when it was printed.
 */
export function LabelPrintHeader({ subject, printedAt }: { subject: LabelView['subject']; printedAt: string }) {
  return (
    <header className="hidden border-b-2 border-black pb-2 text-black print:block" data-testid="label-print-header">
      <p className="text-xs uppercase tracking-widest">Setwell label</p>
      <p className="font-display text-2xl">{subject.name}</p>
      <p className="text-sm">
        {[
          subject.state,
          subject.rules ? `${RULE_SET_LABELS[subject.rules.ruleSet]}, rules of ${formatDate(subject.rules.ruleDate)}` : null,
          `Printed ${formatDateTime(printedAt)}`,
        ].filter(Boolean).join(' · ')}
      </p>
    </header>
  );
}

export function LabelPageBody({ view, apiPath, references, referenceError, printedAt = new Date().toISOString() }: {
  view: LabelView;
  /** When the page was made (the printed header's date); now by default. */
  printedAt?: string;
  apiPath: string;
  /** Formulas that may serve as the claim reference; absent for a frozen label. */
  references?: Array<{ value: string; label: string }>;
  referenceError?: string;
}) {
  const fileName = `label-${view.subject.name.replace(/[^\w.-]+/g, '-').toLowerCase()}`;
  return (
    <div className="space-y-4">
      <LabelPrintHeader subject={view.subject} printedAt={printedAt} />
      <div className="no-print space-y-4">
        <p className="text-sm text-rind-600">{KEPT_NOTES[view.kept]}</p>
        {references ? (
          <form method="get" className="flex flex-wrap items-end gap-3">
            <div className="min-w-0 max-w-md flex-1">
              <SelectField
                label="Reference for a “reduced sugars” claim"
                name="reference"
                defaultValue={view.reference?.choice ?? 'typical'}
                errors={referenceError ? [referenceError] : undefined}
                options={[{ value: 'typical', label: 'A typical jam' }, ...references]}
              />
            </div>
            <Button type="submit" tone="secondary">Compare</Button>
          </form>
        ) : null}
        <div className="flex flex-wrap items-center gap-4">
          <PrintButton label="Print the label" />
          <LabelExportLinks apiPath={apiPath} fileName={fileName} />
        </div>
      </div>
      {view.label ? (
        <LabelPanel label={view.label} heading={`Label of ${view.subject.name}`} />
      ) : (
        <Notice tone="warning" title="No label yet">{view.problem ?? 'The formula cannot be computed.'}</Notice>
      )}
    </div>
  );
}
