import { buttonClass } from '@/components/ui/Button';
import { Field, SelectField } from '@/components/ui/Field';

/** A plain GET form: the scaled sheet is a shareable, printable URL. */
export function SheetScaleForm({ values, errors, massUnits, defaultAltitudeM }: {
  values: Record<string, string>; errors: Record<string, string[]>; massUnits: 'metric' | 'imperial'; defaultAltitudeM: number | null;
}) {
  const massUnit = massUnits === 'imperial' ? 'lb' : 'kg';
  return (
    <form method="get" className="grid gap-3 rounded-card bg-pith-50 p-4 ring-1 ring-pith-300 sm:grid-cols-4" aria-label="Scale the batch sheet">
      <SelectField label="Scale to" name="target" defaultValue={values.target ?? 'total_charge'} errors={errors.target}
        options={[{ value: 'total_charge', label: 'Kettle charge (all ingredients)' }, { value: 'finished_mass', label: 'Finished mass' }, { value: 'jar_count', label: 'Number of jars' }]} />
      <Field label="Amount" name="amount" inputMode="decimal" defaultValue={values.amount ?? ''} errors={errors.amount} hint="Empty: the size it was developed at." />
      <SelectField label="Unit (kettle or finished mass)" name="unit" defaultValue={values.unit ?? massUnit} errors={errors.unit} options={['kg', 'g', 'lb', 'oz'].map((u) => ({ value: u, label: u }))} />
      <div className="grid grid-cols-2 gap-2">
        <Field label="Scale reads to" name="step" inputMode="decimal" defaultValue={values.step ?? (massUnits === 'imperial' ? '0.01' : '5')} errors={errors.step} />
        <SelectField label="in" name="stepUnit" defaultValue={values.stepUnit ?? (massUnits === 'imperial' ? 'lb' : 'g')} errors={errors.stepUnit} options={['g', 'kg', 'lb', 'oz'].map((u) => ({ value: u, label: u }))} />
      </div>
      <Field label="Kitchen altitude (m)" name="altitudeM" inputMode="decimal" defaultValue={values.altitudeM ?? (defaultAltitudeM !== null ? String(defaultAltitudeM) : '')} errors={errors.altitudeM} hint="1 ft = 0.3048 m. Empty: sea level." />
      <SelectField label="Paper" name="paper" defaultValue={values.paper ?? 'a4'} options={[{ value: 'a4', label: 'A4' }, { value: 'letter', label: 'US Letter' }]} />
      <div className="flex items-end"><button type="submit" className={buttonClass('primary')}>Scale</button></div>
    </form>
  );
}
