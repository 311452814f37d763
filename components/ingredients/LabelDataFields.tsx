'use client';

import { Field, FieldErrorText, SelectField } from '@/components/ui/Field';
import { EU_ALLERGENS, NUTRIENT_KEYS, US_ALLERGENS, type NutrientKey } from '@/lib/label/types';
import {
  ADDITIVE_CLASSES,
  ADDITIVE_CLASS_LABELS,
  EU_ALLERGEN_LABELS,
  US_ALLERGEN_LABELS,
  completenessText,
  emptyLabelFields,
  nutrientLabel,
  type IngredientLabelFields,
} from '@/lib/ingredients/label-data';

type FieldErrors = Record<string, string[]>;

/** Form names of the label fields; server errors arrive under `labelData.<path>`. */
const nutrientName = (k: NutrientKey) => `labelData.nutrients.${k}`;
const euName = (k: string) => `labelData.euAllergens.${k}`;
const usName = (k: string) => `labelData.usAllergens.${k}`;

function parseNumber(raw: FormDataEntryValue | null): { value: number | null; valid: boolean } {
  const text = typeof raw === 'string' ? raw.trim().replace(',', '.') : '';
  if (text === '') return { value: null, valid: true };
  const value = Number(text);
  return Number.isFinite(value) ? { value, valid: true } : { value: null, valid: false };
}

function textOf(raw: FormDataEntryValue | null): string {
  return typeof raw === 'string' ? raw.trim() : '';
}

/** Reads the section into the shape `labelDataSchema` expects: an empty box is unknown (null). */
export function readLabelData(form: FormData): { data: unknown; errors: FieldErrors } {
  const errors: FieldErrors = {};
  const nutrients: Record<string, number | null> = {};
  for (const k of NUTRIENT_KEYS) {
    const parsed = parseNumber(form.get(nutrientName(k)));
    if (!parsed.valid) errors[nutrientName(k)] = [`${nutrientLabel(k)} must be a number, or empty when not known.`];
    nutrients[k] = parsed.value;
  }
  const sulphite = parseNumber(form.get('labelData.sulphiteMgPerKg'));
  if (!sulphite.valid) errors['labelData.sulphiteMgPerKg'] = ['Sulphite must be a number, or empty when not known.'];
  const eNumber = textOf(form.get('labelData.additive.eNumber'));
  const functionalClass = textOf(form.get('labelData.additive.functionalClass'));
  return {
    errors,
    data: {
      labelName: textOf(form.get('labelData.labelName')) || null,
      nutrients,
      euAllergens: EU_ALLERGENS.filter((k) => form.get(euName(k)) === 'on'),
      usAllergens: US_ALLERGENS.filter((k) => form.get(usName(k)) === 'on'),
      sulphiteMgPerKg: sulphite.value,
      additive: eNumber || functionalClass ? { eNumber, functionalClass } : null,
      isAddedWater: form.get('labelData.isAddedWater') === 'on',
      source: textOf(form.get('labelData.source')) || null,
    },
  };
}

/** Every error key this section shows beside its own field. */
export function labelFieldKeys(): string[] {
  return [
    ...NUTRIENT_KEYS.map(nutrientName), 'labelData.labelName', 'labelData.sulphiteMgPerKg', 'labelData.additive',
    'labelData.additive.eNumber', 'labelData.additive.functionalClass', 'labelData.source', 'labelData.euAllergens', 'labelData.usAllergens',
    ...EU_ALLERGENS.map((_, i) => `labelData.euAllergens.${i}`), ...US_ALLERGENS.map((_, i) => `labelData.usAllergens.${i}`),
  ];
}

function numberDefault(value: number | null | undefined): string {
  return value == null ? '' : String(value);
}

function errorsUnder(errors: FieldErrors, prefix: string): string[] | undefined {
  const list = Object.entries(errors).filter(([k]) => k === prefix || k.startsWith(`${prefix}.`)).flatMap(([, m]) => m);
  return list.length ? list : undefined;
}

/** "Label and nutrition (per 100 g)": the values the label of a product made with this ingredient needs. */
export function LabelDataFields({ initial, errors, idPrefix }: { initial?: IngredientLabelFields; errors: FieldErrors; idPrefix: string }) {
  const d = initial ?? emptyLabelFields();
  const id = (name: string) => `${idPrefix}-${name.replace(/\./g, '-')}`;
  const status = completenessText(d);
  return (
    <fieldset className="min-w-0 space-y-4 rounded-lg border border-pith-300 p-4" aria-describedby={id('label-intro')}>
      <legend className="px-1 text-base font-semibold text-rind-800">Label and nutrition (per 100 g)</legend>
      <p id={id('label-intro')} className="text-sm text-rind-600">
        Values per 100 g of the ingredient as you use it, from your supplier&apos;s sheet or a food table. Leave a box empty when the value is
        not known: the label then says the figure is incomplete, never counts it as 0. Now: <span className="font-medium">{status.text}</span>.
      </p>

      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <Field id={id('labelData.labelName')} label="Name in the ingredient list" name="labelData.labelName" defaultValue={d.labelName ?? ''} maxLength={120} errors={errors['labelData.labelName']} hint="e.g. strawberries, sugar, pectin. Empty: the ingredient's name." />
        <Field id={id('labelData.source')} label="Where these values come from" name="labelData.source" defaultValue={d.source ?? ''} maxLength={500} errors={errors['labelData.source']} hint="Supplier sheet, food table entry…" />
      </div>

      <div className="grid grid-cols-1 gap-4 sm:grid-cols-3" role="group" aria-label="Nutrients per 100 g">
        {NUTRIENT_KEYS.map((k) => (
          <Field
            key={k}
            id={id(nutrientName(k))}
            label={nutrientLabel(k)}
            name={nutrientName(k)}
            inputMode="decimal"
            placeholder="unknown"
            defaultValue={numberDefault(d.nutrients[k])}
            errors={errors[nutrientName(k)]}
          />
        ))}
      </div>

      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <fieldset className="min-w-0">
          <legend className="mb-2 text-sm font-semibold text-rind-700">Allergens, EU (Regulation 1169/2011 Annex II)</legend>
          <div className="grid grid-cols-1 gap-1">
            {EU_ALLERGENS.map((k) => (
              <label key={k} htmlFor={id(euName(k))} className="flex min-h-10 items-center gap-3 text-sm text-rind-700">
                <input id={id(euName(k))} type="checkbox" name={euName(k)} defaultChecked={d.euAllergens.includes(k)} className="h-5 w-5 shrink-0 rounded border-rind-300 text-damson-700" />
                <span className="min-w-0">{EU_ALLERGEN_LABELS[k]}</span>
              </label>
            ))}
          </div>
          <FieldErrorText id={id('eu-allergens-err')} errors={errorsUnder(errors, 'labelData.euAllergens')} />
        </fieldset>
        <fieldset className="min-w-0">
          <legend className="mb-2 text-sm font-semibold text-rind-700">Allergens, US (major food allergens)</legend>
          <div className="grid grid-cols-1 gap-1">
            {US_ALLERGENS.map((k) => (
              <label key={k} htmlFor={id(usName(k))} className="flex min-h-10 items-center gap-3 text-sm text-rind-700">
                <input id={id(usName(k))} type="checkbox" name={usName(k)} defaultChecked={d.usAllergens.includes(k)} className="h-5 w-5 shrink-0 rounded border-rind-300 text-damson-700" />
                <span className="min-w-0">{US_ALLERGEN_LABELS[k]}</span>
              </label>
            ))}
          </div>
          <FieldErrorText id={id('us-allergens-err')} errors={errorsUnder(errors, 'labelData.usAllergens')} />
        </fieldset>
      </div>

      <div className="grid grid-cols-1 gap-4 sm:grid-cols-3">
        <Field id={id('labelData.sulphiteMgPerKg')} label="Sulphite (mg SO₂ per kg)" name="labelData.sulphiteMgPerKg" inputMode="decimal" placeholder="unknown" defaultValue={numberDefault(d.sulphiteMgPerKg)} errors={errors['labelData.sulphiteMgPerKg']} />
        <Field id={id('labelData.additive.eNumber')} label="E-number, if an additive" name="labelData.additive.eNumber" defaultValue={d.additive?.eNumber ?? ''} maxLength={12} errors={errorsUnder(errors, 'labelData.additive.eNumber') ?? (errors['labelData.additive'])} hint="e.g. E440" />
        <SelectField
          id={id('labelData.additive.functionalClass')}
          label="Additive class"
          name="labelData.additive.functionalClass"
          defaultValue={d.additive?.functionalClass ?? ''}
          errors={errors['labelData.additive.functionalClass']}
          options={[{ value: '', label: 'Not an additive' }, ...ADDITIVE_CLASSES.map((c) => ({ value: c, label: ADDITIVE_CLASS_LABELS[c] }))]}
        />
      </div>

      <label htmlFor={id('labelData.isAddedWater')} className="flex min-h-10 items-center gap-3 text-sm text-rind-700">
        <input id={id('labelData.isAddedWater')} type="checkbox" name="labelData.isAddedWater" defaultChecked={d.isAddedWater} className="h-5 w-5 shrink-0 rounded border-rind-300 text-damson-700" />
        <span className="min-w-0">Water added as such (the ingredient list may leave it out when it evaporates)</span>
      </label>
    </fieldset>
  );
}
