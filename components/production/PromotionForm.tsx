'use client';

import { useMemo, useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { Field, FieldErrorText, SelectField, inputClass } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { qcSpecCautions, type QcSpec } from '@/lib/chemistry';
import type { PromotionDraftVariant } from '@/lib/production/queries';
import { requestPromotionAction } from '@/lib/production/actions';
import { CautionList } from './CautionList';
import { fromDisplayTemperature, parseNumber, toDisplayTemperature, type TemperatureUnit } from './temperature';

type SpecText = Record<keyof QcSpec, string>;

function specText(spec: QcSpec, unit: TemperatureUnit): SpecText {
  return {
    solidsMinBrix: String(spec.solidsMinBrix), solidsMaxBrix: String(spec.solidsMaxBrix), phMin: String(spec.phMin), phMax: String(spec.phMax),
    minFillTempC: toDisplayTemperature(spec.minFillTempC, unit), netFillG: String(spec.netFillG), netFillToleranceG: String(spec.netFillToleranceG),
    setMinScore: String(spec.setMinScore), setDescription: spec.setDescription, shelfLifeMonths: String(spec.shelfLifeMonths), storageNotes: spec.storageNotes,
  };
}

function specFromText(t: SpecText, unit: TemperatureUnit) {
  return {
    solidsMinBrix: parseNumber(t.solidsMinBrix), solidsMaxBrix: parseNumber(t.solidsMaxBrix), phMin: parseNumber(t.phMin), phMax: parseNumber(t.phMax),
    minFillTempC: fromDisplayTemperature(t.minFillTempC, unit), netFillG: parseNumber(t.netFillG), netFillToleranceG: parseNumber(t.netFillToleranceG),
    setMinScore: parseNumber(t.setMinScore), setDescription: t.setDescription, shelfLifeMonths: parseNumber(t.shelfLifeMonths), storageNotes: t.storageNotes,
  };
}

/** The developer's request: which variant, which product, how it is made, and the QC spec (pre-filled from the chemistry). */
export function PromotionForm({ trialId, variants, products, recommendedVariantId, recommendationRationale, temperatureUnit }: {
  trialId: string;
  variants: PromotionDraftVariant[];
  products: Array<{ id: string; code: string; name: string }>;
  recommendedVariantId: string | null;
  recommendationRationale: string | null;
  temperatureUnit: TemperatureUnit;
}) {
  const router = useRouter();
  const unit = temperatureUnit;
  const promotable = variants.filter((v) => v.defaults);
  const initial = promotable.find((v) => v.id === recommendedVariantId) ?? promotable[0];
  const [variantId, setVariantId] = useState(initial?.id ?? '');
  const variant = variants.find((v) => v.id === variantId);
  const [mode, setMode] = useState<'new' | 'existing'>(products.length ? 'existing' : 'new');
  const [productId, setProductId] = useState(products[0]?.id ?? '');
  const [newName, setNewName] = useState('');
  const [newCode, setNewCode] = useState('');
  const [rationale, setRationale] = useState(recommendationRationale ?? '');
  const [endPoint, setEndPoint] = useState(initial?.defaults ? toDisplayTemperature(initial.defaults.process.endPointSeaLevelC, unit) : '');
  const [fillTemp, setFillTemp] = useState(initial?.defaults ? toDisplayTemperature(initial.defaults.process.fillTempC, unit) : '');
  const [cookNotes, setCookNotes] = useState('');
  const [spec, setSpec] = useState<SpecText | null>(initial?.defaults ? specText(initial.defaults.spec, unit) : null);
  const [fields, setFields] = useState<Record<string, string[]>>({});
  const [error, setError] = useState<string>();
  const [busy, setBusy] = useState(false);

  const liveCautions = useMemo(() => {
    if (!spec || !variant) return [];
    const s = specFromText(spec, unit);
    if (Object.values(s).some((x) => x === null)) return [];
    return qcSpecCautions(s as QcSpec, variant.productClass);
  }, [spec, unit, variant]);

  function chooseVariant(id: string) {
    setVariantId(id);
    const v = variants.find((x) => x.id === id);
    if (v?.defaults) {
      setSpec(specText(v.defaults.spec, unit));
      setEndPoint(toDisplayTemperature(v.defaults.process.endPointSeaLevelC, unit));
      setFillTemp(toDisplayTemperature(v.defaults.process.fillTempC, unit));
    }
  }

  if (!promotable.length) {
    return <Notice tone="warning" title="Nothing to promote yet">No variant of this trial has computable chemistry. Fix the formula lines first.</Notice>;
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    if (!spec) return;
    setBusy(true);
    setError(undefined);
    setFields({});
    const res = await requestPromotionAction({
      trialId, variantId,
      ...(mode === 'existing' ? { productId } : { newProductName: newName, newProductCode: newCode.trim().toUpperCase() }),
      rationale,
      process: { endPointSeaLevelC: fromDisplayTemperature(endPoint, unit), fillTempC: fromDisplayTemperature(fillTemp, unit), cookNotes },
      spec: specFromText(spec, unit),
    });
    setBusy(false);
    if (res.ok) {
      router.push(`/production/reviews/${res.data.requestId}`);
      router.refresh();
    } else {
      setFields(res.fields ?? {});
      setError(res.error);
    }
  }

  const specField = (key: keyof QcSpec, label: string, hint?: string, inputMode: 'decimal' | 'numeric' | 'text' = 'decimal') => (
    <Field
      label={label} name={`spec.${key}`} id={`f-spec-${key}`} inputMode={inputMode} hint={hint} value={spec?.[key] ?? ''}
      onChange={(e) => setSpec((s) => (s ? { ...s, [key]: e.target.value } : s))} errors={fields[`spec.${key}`]}
    />
  );
  const deg = unit === 'F' ? '°F' : '°C';

  return (
    <form onSubmit={submit} className="space-y-6" aria-label="Request promotion" noValidate>
      <section className="space-y-3 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
        <h2 className="text-lg font-semibold">What goes to production</h2>
        <SelectField
          label="Variant" name="variantId" value={variantId} onChange={(e) => chooseVariant(e.target.value)} errors={fields.variantId}
          options={promotable.map((v) => ({ value: v.id, label: `${v.label} — ${v.description}${v.id === recommendedVariantId ? ' (recommended)' : ''}${v.complianceOverall === 'non_compliant' ? ' — fails its market rules' : ''}` }))}
        />
        <fieldset className="space-y-2">
          <legend className="mb-1 text-sm font-medium text-rind-700">Which product</legend>
          <div className="flex flex-wrap gap-4 text-sm">
            <label className="flex items-center gap-2"><input type="radio" name="mode" checked={mode === 'existing'} disabled={!products.length} onChange={() => setMode('existing')} /> New version of a product</label>
            <label className="flex items-center gap-2"><input type="radio" name="mode" checked={mode === 'new'} onChange={() => setMode('new')} /> A new product</label>
          </div>
          {mode === 'existing' ? (
            <SelectField label="Product" name="productId" value={productId} onChange={(e) => setProductId(e.target.value)} errors={fields.productId} options={products.map((p) => ({ value: p.id, label: `${p.name} (${p.code})` }))} />
          ) : (
            <div className="grid gap-3 sm:grid-cols-2">
              <Field label="Product name" name="newProductName" value={newName} onChange={(e) => setNewName(e.target.value)} errors={fields.newProductName} />
              <Field label="Product code" name="newProductCode" value={newCode} onChange={(e) => setNewCode(e.target.value)} errors={fields.newProductCode} hint="2–5 capital letters; every lot code starts with it." autoCapitalize="characters" />
            </div>
          )}
        </fieldset>
        <div>
          <label htmlFor="f-rationale" className="mb-1 block text-sm font-medium text-rind-700">Why this variant</label>
          <textarea id="f-rationale" name="rationale" rows={3} value={rationale} onChange={(e) => setRationale(e.target.value)} className={inputClass} aria-invalid={fields.rationale ? true : undefined} aria-describedby={fields.rationale ? 'f-rationale-err' : undefined} />
          <FieldErrorText id="f-rationale-err" errors={fields.rationale} />
          <p className="mt-1 text-xs text-rind-500">The comparison, tasting verdicts, lab readings and compliance result are attached automatically.</p>
        </div>
      </section>

      <section className="space-y-3 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
        <h2 className="text-lg font-semibold">Process</h2>
        <div className="grid gap-3 sm:grid-cols-2">
          <Field label={`End point at sea level (${deg})`} name="process.endPointSeaLevelC" inputMode="decimal" value={endPoint} onChange={(e) => setEndPoint(e.target.value)} errors={fields['process.endPointSeaLevelC']} hint="The batch sheet moves it for the kitchen’s altitude." />
          <Field label={`Target fill temperature (${deg})`} name="process.fillTempC" inputMode="decimal" value={fillTemp} onChange={(e) => setFillTemp(e.target.value)} errors={fields['process.fillTempC']} />
        </div>
        <div>
          <label htmlFor="f-cook-notes" className="mb-1 block text-sm font-medium text-rind-700">Cook notes</label>
          <textarea id="f-cook-notes" name="process.cookNotes" rows={3} value={cookNotes} onChange={(e) => setCookNotes(e.target.value)} className={inputClass} />
          <FieldErrorText id="f-cook-notes-err" errors={fields['process.cookNotes']} />
        </div>
      </section>

      <section className="space-y-3 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
        <h2 className="text-lg font-semibold">QC specification</h2>
        <p className="text-sm text-rind-600">Pre-filled from the variant’s chemistry: the target solids ± 1 °Brix (never below the legal minimum), the planned pH ± 0.2, a hot fill at 85 °C or above, and the tolerable negative error for the jar size. Tighten them if the kitchen can hold them.</p>
        <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
          {specField('solidsMinBrix', 'Solids min (°Brix at 20 °C)')}
          {specField('solidsMaxBrix', 'Solids max (°Brix at 20 °C)')}
          {specField('phMin', 'pH min')}
          {specField('phMax', 'pH max', 'Never above 4.6.')}
          {specField('minFillTempC', `Minimum fill (${deg})`)}
          {specField('netFillG', 'Net fill (g)')}
          {specField('netFillToleranceG', 'Fill tolerance (g)', 'Per jar, below the declared fill.')}
          {specField('setMinScore', 'Minimum set score (1–5)', undefined, 'numeric')}
          {specField('shelfLifeMonths', 'Shelf life (months)', undefined, 'numeric')}
        </div>
        <div className="grid gap-3 sm:grid-cols-2">
          {specField('setDescription', 'Expected set', undefined, 'text')}
          {specField('storageNotes', 'Storage notes', undefined, 'text')}
        </div>
        <CautionList cautions={liveCautions} />
      </section>

      {error ? <Notice tone="danger">{error}</Notice> : null}
      <Button type="submit" disabled={busy}>{busy ? 'Sending…' : 'Request promotion'}</Button>
    </form>
  );
}
