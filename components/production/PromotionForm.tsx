'use client';

import { useMemo, useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { Field, FieldErrorText, SelectField, inputClass } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { qcSpecCautions, type QcSpec } from '@/lib/chemistry';
import type { PromotionDraftVariant, PromotionResubmission, PromotionTargetProduct } from '@/lib/production/schema';
import { describeIdentity, identityDifferences } from '@/lib/production/review';
import type { PromotionTarget } from '@/lib/production/vocabulary';
import { requestPromotionAction } from '@/lib/production/actions';
import { CautionList } from '@/components/ui/CautionList';
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

/** The variant beside what it would replace, with a warning when the fruit or product class differ. */
function TargetComparison({ variant, mode, product, newName }: { variant: PromotionDraftVariant; mode: PromotionTarget; product: PromotionTargetProduct | undefined; newName: string }) {
  if (mode === 'existing_product' && !product) return null;
  const current = mode === 'existing_product' ? product?.current ?? null : null;
  const currentName = product && current ? `${product.name} v${current.version}` : '';
  const differences = current ? identityDifferences(variant, current, currentName) : [];
  const outcome = mode === 'new_product'
    ? `Becomes version 1 of ${newName.trim() || 'the new product'}.`
    : current
      ? `Becomes version ${product!.nextVersion} of ${product!.name} and, once approved, supersedes version ${current.version} now in production.`
      : `Becomes version ${product!.nextVersion} of ${product!.name}; no version of it is in production now.`;
  return (
    <div className="space-y-2" data-testid="target-comparison">
      <dl className="grid gap-2 text-sm sm:grid-cols-2">
        <div className="rounded-lg bg-white/70 px-3 py-2 ring-1 ring-pith-300">
          <dt className="text-xs uppercase tracking-wider text-rind-500">This variant</dt>
          <dd>{variant.label} — {describeIdentity(variant)}</dd>
        </div>
        {current ? (
          <div className="rounded-lg bg-white/70 px-3 py-2 ring-1 ring-pith-300">
            <dt className="text-xs uppercase tracking-wider text-rind-500">In production now</dt>
            <dd>{currentName} — {describeIdentity(current)}</dd>
          </div>
        ) : null}
      </dl>
      <p className="text-sm text-rind-700">{outcome}</p>
      {differences.length ? (
        <Notice tone="warning" title={`This variant is not like ${currentName}`}>
          <ul className="list-disc pl-5">{differences.map((d) => <li key={d}>{d}</li>)}</ul>
          <p className="mt-1">Approving it would replace that spec in production. If this is another product, choose “A new product”.</p>
        </Notice>
      ) : null}
    </div>
  );
}

/** The developer's request: which variant, which product, how it is made, and the QC spec (pre-filled from the chemistry). */
export function PromotionForm({ trialId, variants, products, recommendedVariantId, recommendationRationale, temperatureUnit, resubmission = null }: {
  trialId: string;
  variants: PromotionDraftVariant[];
  products: PromotionTargetProduct[];
  recommendedVariantId: string | null;
  recommendationRationale: string | null;
  temperatureUnit: TemperatureUnit;
  /** The sent-back request this one is filed after: the form starts from its choices and words. */
  resubmission?: PromotionResubmission | null;
}) {
  const router = useRouter();
  const unit = temperatureUnit;
  const promotable = variants.filter((v) => v.defaults);
  const before = resubmission && promotable.some((v) => v.id === resubmission.variantId) ? resubmission : null;
  const initial = promotable.find((v) => v.id === (before?.variantId ?? recommendedVariantId)) ?? promotable[0];
  const [variantId, setVariantId] = useState(initial?.id ?? '');
  const variant = variants.find((v) => v.id === variantId);
  const beforeProduct = before?.productId && products.some((p) => p.id === before.productId) ? before.productId : null;
  // No default: filing a strawberry variant as the next blackcurrant version must be a choice, never a click-through
  // (a re-submission repeats the choice already made).
  const [mode, setMode] = useState<PromotionTarget | null>(beforeProduct ? 'existing_product' : before?.newProductName ? 'new_product' : null);
  const [productId, setProductId] = useState(beforeProduct ?? '');
  const product = products.find((p) => p.id === productId);
  const [newName, setNewName] = useState(before?.newProductName ?? '');
  const [newCode, setNewCode] = useState(before?.newProductCode ?? '');
  const [rationale, setRationale] = useState(before?.rationale ?? recommendationRationale ?? '');
  const startProcess = before?.process ?? initial?.defaults?.process;
  const [endPoint, setEndPoint] = useState(startProcess ? toDisplayTemperature(startProcess.endPointSeaLevelC, unit) : '');
  const [fillTemp, setFillTemp] = useState(startProcess ? toDisplayTemperature(startProcess.fillTempC, unit) : '');
  const [cookNotes, setCookNotes] = useState(before?.process.cookNotes ?? '');
  const startSpec = before?.spec ?? initial?.defaults?.spec;
  const [spec, setSpec] = useState<SpecText | null>(startSpec ? specText(startSpec, unit) : null);
  const [fields, setFields] = useState<Record<string, string[]>>({});
  const [error, setError] = useState<string>();
  const [busy, setBusy] = useState(false);

  const liveCautions = useMemo(() => {
    if (!spec || !variant) return [];
    const s = specFromText(spec, unit);
    if (Object.values(s).some((x) => x === null)) return [];
    return qcSpecCautions(s as QcSpec, variant.productClass, variant.preservation ?? undefined);
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
    if (!mode) {
      setFields({ target: ['Choose whether this is a new product or a new version of an existing one.'] });
      setError('Choose where this variant goes.');
      return;
    }
    setBusy(true);
    setError(undefined);
    setFields({});
    const res = await requestPromotionAction({
      trialId, variantId, target: mode,
      ...(mode === 'existing_product' ? { productId: productId || undefined } : { newProductName: newName, newProductCode: newCode.trim().toUpperCase() }),
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
        <fieldset className="space-y-3" aria-describedby={fields.target ? 'f-target-err' : undefined}>
          <legend className="mb-1 text-sm font-medium text-rind-700">Where it goes</legend>
          <div className="flex flex-col gap-2 text-sm sm:flex-row sm:flex-wrap sm:gap-6">
            <label className="flex items-center gap-2"><input type="radio" name="target" value="new_product" checked={mode === 'new_product'} onChange={() => setMode('new_product')} /> A new product</label>
            <label className="flex items-center gap-2"><input type="radio" name="target" value="existing_product" checked={mode === 'existing_product'} disabled={!products.length} onChange={() => setMode('existing_product')} /> A new version of an existing product</label>
          </div>
          <FieldErrorText id="f-target-err" errors={fields.target} />
          {mode === 'existing_product' ? (
            <SelectField
              label="Product" name="productId" value={productId} onChange={(e) => setProductId(e.target.value)} errors={fields.productId}
              options={[{ value: '', label: 'Choose a product…' }, ...products.map((p) => ({ value: p.id, label: `${p.name} (${p.code})` }))]}
            />
          ) : null}
          {mode === 'new_product' ? (
            <div className="grid gap-3 sm:grid-cols-2">
              <Field label="Product name" name="newProductName" value={newName} onChange={(e) => setNewName(e.target.value)} errors={fields.newProductName} />
              <Field label="Product code" name="newProductCode" value={newCode} onChange={(e) => setNewCode(e.target.value)} errors={fields.newProductCode} hint="2–5 capital letters; every lot code starts with it." autoCapitalize="characters" />
            </div>
          ) : null}
          {variant && mode ? <TargetComparison variant={variant} mode={mode} product={product} newName={newName} /> : null}
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
