'use client';

import { useState, useTransition } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { Field, FieldErrorText, SelectField, inputClass } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { saveIngredientAction } from '@/lib/ingredients/actions';
import { readFieldNumber } from '@/lib/format/numbers';
import { LabelDataFields, labelFieldKeys, readLabelData } from './LabelDataFields';
import {
  ACID_TYPES,
  EU_FRUIT_GROUPS,
  EU_GROUP_LABELS,
  INGREDIENT_KINDS,
  KIND_LABELS,
  PECTIN_LEVELS,
  PECTIN_TYPES,
  PECTIN_TYPE_LABELS,
  SWEETENER_TYPES,
  US_FRUIT_GROUPS,
  type IngredientInput,
  type IngredientView,
} from '@/lib/ingredients/schema';

type Kind = (typeof INGREDIENT_KINDS)[number];
type FieldErrors = Record<string, string[]>;

const SWEETENER_TYPE_LABELS: Record<(typeof SWEETENER_TYPES)[number], string> = {
  sucrose: 'Sucrose (white sugar)',
  glucose_syrup: 'Glucose syrup',
  invert_sugar: 'Invert sugar',
  honey: 'Honey',
  fructose: 'Fructose',
  dextrose: 'Dextrose (glucose)',
  other: 'Other sweetener',
};
const ACID_TYPE_LABELS: Record<(typeof ACID_TYPES)[number], string> = {
  citric: 'Citric acid',
  malic: 'Malic acid',
  tartaric: 'Tartaric acid',
  lemon_juice: 'Lemon juice',
  other: 'Other acid',
};
const PECTIN_LEVEL_LABELS: Record<(typeof PECTIN_LEVELS)[number], string> = { high: 'High', medium: 'Medium', low: 'Low' };
const US_GROUP_LABELS: Record<(typeof US_FRUIT_GROUPS)[number], string> = { '1': 'Group I', '2': 'Group II' };

/** Which optional properties the form asks for, by kind; the rest are saved as null. */
export const KIND_FIELDS: Record<Kind, ReadonlyArray<keyof IngredientInput>> = {
  fruit: ['phMin', 'phMax', 'pectinLevel', 'euFruitGroup', 'usFruitGroup'],
  sweetener: ['sweetenerType'],
  pectin: ['pectinType', 'pectinGrade'],
  acid: ['phMin', 'phMax', 'acidType', 'acidPct'],
  water: [],
  other: ['phMin', 'phMax', 'calciumSource'],
};

const ALWAYS_SHOWN = ['name', 'kind', 'solidsPct', 'notes'] as const;
const NUMBER_FIELDS = ['solidsPct', 'phMin', 'phMax', 'acidPct', 'pectinGrade'] as const;
const NUMBER_LABELS: Record<(typeof NUMBER_FIELDS)[number], string> = {
  solidsPct: 'Soluble solids',
  phMin: 'pH',
  phMax: 'pH',
  acidPct: 'Acid content',
  pectinGrade: 'Pectin grade',
};
const CHOICE_FIELDS = ['pectinLevel', 'euFruitGroup', 'usFruitGroup', 'pectinType', 'sweetenerType', 'acidType'] as const;

function options<T extends string>(values: readonly T[], labels: Record<T, string>, emptyLabel?: string) {
  const list = values.map((v) => ({ value: v, label: labels[v] }));
  return emptyLabel ? [{ value: '', label: emptyLabel }, ...list] : list;
}

function text(raw: FormDataEntryValue | null): string {
  return typeof raw === 'string' ? raw : '';
}

/** Server field keys are paths under the action's own wrapper (`data.solidsPct`); the form knows `solidsPct`. */
export function stripFieldPrefix(fields: FieldErrors | undefined): FieldErrors {
  const out: FieldErrors = {};
  for (const [key, messages] of Object.entries(fields ?? {})) {
    const bare = key.replace(/^(data|change)\./, '');
    out[bare] = [...(out[bare] ?? []), ...messages];
  }
  return out;
}

/**
 * Reads the form into the shape `ingredientInputSchema` expects: numbers as numbers, empty
 * boxes as null, and properties that do not apply to the kind as null so an old value cannot linger.
 */
export function buildIngredientInput(form: FormData, kind: Kind): { data: IngredientInput; errors: FieldErrors } {
  const applies = new Set<string>(KIND_FIELDS[kind]);
  const errors: FieldErrors = {};
  const numbers: Partial<Record<(typeof NUMBER_FIELDS)[number], number | null>> = {};
  for (const field of NUMBER_FIELDS) {
    if (field !== 'solidsPct' && !applies.has(field)) {
      numbers[field] = null;
      continue;
    }
    const parsed = readFieldNumber(form.get(field));
    if (!parsed.valid) errors[field] = [`${NUMBER_LABELS[field]} must be a number.`];
    numbers[field] = parsed.value;
  }
  const choices: Record<string, string | null> = {};
  for (const field of CHOICE_FIELDS) {
    const value = applies.has(field) ? text(form.get(field)) : '';
    choices[field] = value === '' ? null : value;
  }
  const notes = text(form.get('notes')).trim();
  const label = readLabelData(form);
  Object.assign(errors, label.errors);
  const data = {
    name: text(form.get('name')).trim(),
    kind,
    // null reaches the server schema, which answers with its own "must be a number" message.
    solidsPct: numbers.solidsPct as number,
    phMin: numbers.phMin,
    phMax: numbers.phMax,
    acidPct: numbers.acidPct,
    pectinGrade: numbers.pectinGrade,
    ...choices,
    calciumSource: applies.has('calciumSource') ? form.get('calciumSource') === 'on' : false,
    notes: notes === '' ? null : notes,
    labelData: label.data,
  } as IngredientInput;
  return { data, errors };
}

function numberDefault(value: number | null | undefined): string {
  return value == null ? '' : String(value);
}

/** Create or edit one library ingredient. Only the properties that matter for the chosen kind are asked for. */
export function IngredientForm({ initial, onSavedHref = '/ingredients' }: { initial?: IngredientView; onSavedHref?: string }) {
  const router = useRouter();
  const [kind, setKind] = useState<Kind>(initial?.kind ?? 'fruit');
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string>();
  const [pending, startTransition] = useTransition();
  const applies = new Set<string>(KIND_FIELDS[kind]);

  function submit(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const { data, errors: localErrors } = buildIngredientInput(new FormData(e.currentTarget), kind);
    setFormError(undefined);
    if (Object.keys(localErrors).length) {
      setErrors(localErrors);
      return;
    }
    setErrors({});
    startTransition(async () => {
      const result = await saveIngredientAction(initial?.id ?? null, data);
      if (result.ok) {
        // The list says which ingredient was saved (by id: the page reads its name, so a link cannot make it say anything else).
        router.push(`${onSavedHref}${onSavedHref.includes('?') ? '&' : '?'}saved=${result.data.ingredientId}`);
        router.refresh();
        return;
      }
      const fields = stripFieldPrefix(result.fields);
      setErrors(fields);
      // Errors not tied to a visible field (e.g. an unknown id) still need to be seen.
      const visible = new Set<string>([...ALWAYS_SHOWN, ...KIND_FIELDS[kind], ...labelFieldKeys()]);
      const unplaced = Object.entries(fields).filter(([key]) => !visible.has(key)).flatMap(([, m]) => m);
      if (!Object.keys(fields).length || unplaced.length) setFormError(unplaced.length ? unplaced.join(' ') : result.error);
    });
  }

  const idPrefix = initial ? `ingredient-${initial.id}` : 'ingredient-new';
  const id = (name: string) => `${idPrefix}-${name}`;

  return (
    <form onSubmit={submit} noValidate className="max-w-2xl space-y-5" aria-label={initial ? `Edit ${initial.name}` : 'New ingredient'}>
      {initial?.origin === 'typical' ? (
        <Notice tone="warning" title="You are editing a typical value">
          Saving makes this your workspace&apos;s own edited value. The handbook source
          {initial.source ? <> (<span className="italic">{initial.source}</span>)</> : null} will no longer apply to it.
        </Notice>
      ) : null}
      {initial?.origin === 'edited' ? (
        <Notice tone="info">This started as a typical value and has been edited by your workspace.</Notice>
      ) : null}
      {formError ? <Notice tone="danger">{formError}</Notice> : null}

      <div className="grid gap-4 sm:grid-cols-2">
        <Field id={id('name')} label="Name" name="name" required defaultValue={initial?.name ?? ''} errors={errors.name} maxLength={120} />
        <SelectField
          id={id('kind')}
          label="Kind"
          name="kind"
          value={kind}
          onChange={(e) => setKind(e.target.value as Kind)}
          errors={errors.kind}
          options={options(INGREDIENT_KINDS, KIND_LABELS)}
        />
        <Field
          id={id('solidsPct')}
          label="Soluble solids (°Brix / %)"
          name="solidsPct"
          inputMode="decimal"
          required
          defaultValue={numberDefault(initial?.solidsPct)}
          errors={errors.solidsPct}
          hint="Refractometer reading or handbook value; sugar and pectin powders count as 100 %."
        />
      </div>

      {applies.has('phMin') ? (
        <fieldset className="grid gap-4 sm:grid-cols-2">
          <legend className="mb-2 text-sm font-semibold text-rind-700">pH range</legend>
          <Field id={id('phMin')} label="pH, lower" name="phMin" inputMode="decimal" defaultValue={numberDefault(initial?.phMin)} errors={errors.phMin} />
          <Field id={id('phMax')} label="pH, upper" name="phMax" inputMode="decimal" defaultValue={numberDefault(initial?.phMax)} errors={errors.phMax} />
        </fieldset>
      ) : null}

      {kind === 'fruit' ? (
        <fieldset className="grid gap-4 sm:grid-cols-3">
          <legend className="mb-2 text-sm font-semibold text-rind-700">Fruit</legend>
          <SelectField id={id('pectinLevel')} label="Pectin level" name="pectinLevel" defaultValue={initial?.pectinLevel ?? ''} errors={errors.pectinLevel} options={options(PECTIN_LEVELS, PECTIN_LEVEL_LABELS, 'Not given')} />
          <SelectField id={id('euFruitGroup')} label="EU fruit group" name="euFruitGroup" defaultValue={initial?.euFruitGroup ?? ''} errors={errors.euFruitGroup} options={options(EU_FRUIT_GROUPS, EU_GROUP_LABELS, 'Not given (checked as general)')} />
          <SelectField id={id('usFruitGroup')} label="US fruit group (21 CFR 150.160)" name="usFruitGroup" defaultValue={initial?.usFruitGroup ?? ''} errors={errors.usFruitGroup} options={options(US_FRUIT_GROUPS, US_GROUP_LABELS, 'Not listed')} />
        </fieldset>
      ) : null}

      {kind === 'sweetener' ? (
        <SelectField id={id('sweetenerType')} label="Sweetener type" name="sweetenerType" defaultValue={initial?.sweetenerType ?? ''} errors={errors.sweetenerType} options={options(SWEETENER_TYPES, SWEETENER_TYPE_LABELS, 'Choose…')} />
      ) : null}

      {kind === 'pectin' ? (
        <div className="grid gap-4 sm:grid-cols-2">
          <SelectField id={id('pectinType')} label="Pectin type" name="pectinType" defaultValue={initial?.pectinType ?? ''} errors={errors.pectinType} options={options(PECTIN_TYPES, PECTIN_TYPE_LABELS, 'Choose…')} />
          <Field
            id={id('pectinGrade')}
            label="Pectin grade"
            name="pectinGrade"
            inputMode="decimal"
            defaultValue={numberDefault(initial?.pectinGrade)}
            errors={errors.pectinGrade}
            hint="Grams of sugar 1 g of pectin sets at 65 % solids and optimum pH (e.g. 150)."
          />
        </div>
      ) : null}

      {kind === 'acid' ? (
        <div className="grid gap-4 sm:grid-cols-2">
          <SelectField id={id('acidType')} label="Acid type" name="acidType" defaultValue={initial?.acidType ?? ''} errors={errors.acidType} options={options(ACID_TYPES, ACID_TYPE_LABELS, 'Not given')} />
          <Field id={id('acidPct')} label="Acid content (% as citric)" name="acidPct" inputMode="decimal" defaultValue={numberDefault(initial?.acidPct)} errors={errors.acidPct} />
        </div>
      ) : null}

      {kind === 'other' ? (
        <div>
          <label htmlFor={id('calciumSource')} className="flex min-h-10 items-center gap-3 text-sm text-rind-700">
            <input id={id('calciumSource')} type="checkbox" name="calciumSource" defaultChecked={initial?.calciumSource ?? false} className="h-5 w-5 rounded border-rind-300 text-damson-700" />
            Supplies calcium (for low-methoxyl pectin sets)
          </label>
          <FieldErrorText id={`${id('calciumSource')}-err`} errors={errors.calciumSource} />
        </div>
      ) : null}

      <LabelDataFields initial={initial?.labelData} errors={errors} idPrefix={idPrefix} />

      <div>
        <label htmlFor={id('notes')} className="mb-1 block text-sm font-medium text-rind-700">Notes</label>
        <textarea
          id={id('notes')}
          name="notes"
          rows={3}
          maxLength={1000}
          defaultValue={initial?.notes ?? ''}
          aria-invalid={errors.notes?.length ? true : undefined}
          aria-describedby={errors.notes?.length ? `${id('notes')}-err` : undefined}
          className={inputClass}
        />
        <FieldErrorText id={`${id('notes')}-err`} errors={errors.notes} />
      </div>

      <div className="flex flex-wrap gap-3">
        <Button type="submit" disabled={pending}>{pending ? 'Saving…' : initial ? 'Save changes' : 'Add ingredient'}</Button>
        <Link href={onSavedHref} className="inline-flex min-h-10 items-center px-2 text-sm text-damson-700 underline-offset-2 hover:underline">Cancel</Link>
      </div>
    </form>
  );
}
