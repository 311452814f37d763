'use client';

import { PRESERVATION_LABELS, PRESERVATION_METHODS, type UnitPreference } from '@/lib/chemistry';
import { PRODUCT_CLASS_LABELS, PRODUCT_CLASSES, RULE_DATE_MAX, RULE_DATE_MIN, RULE_SET_LABELS, RULE_SETS } from '@/lib/formulas/schema';
import { isAmbiguousComma, unreadableNumberMessage } from '@/lib/format/numbers';
import { altitudeScale, draftFromText, jarFillScale, temperatureScale, type DisplayScale, type MeasuredDraft, type TemperatureUnit } from '@/lib/format/quantities';
import { Card } from '@/components/ui/Card';
import { Field, SelectField } from '@/components/ui/Field';
import { settingsTextToDraft, type SettingsDraft } from '../editor-state';

const productClassOptions = PRODUCT_CLASSES.map((c) => ({ value: c, label: PRODUCT_CLASS_LABELS[c] }));
const ruleSetOptions = RULE_SETS.map((r) => ({ value: r, label: RULE_SET_LABELS[r] }));
const preservationOptions = [{ value: '', label: 'Not stated (sugar and acidity alone)' }, ...PRESERVATION_METHODS.map((m) => ({ value: m, label: PRESERVATION_LABELS[m] }))];

/** The settings typed as numbers; each keeps its draft (typed text + value in storage units) under this key. */
type NumericSettingKey = 'targetSolids' | 'jarFill' | 'plannedPh' | 'sucroseInversion' | 'altitude' | 'measuredBoiling';
/** The user's display unit of a setting kept in storage units (g, m, °C). */
type SettingScale = 'jarFill' | 'altitude' | 'boiling';

interface NumericSetting {
  /** The schema's field (`settings.…`): the input's name and the key of its errors. */
  name: string;
  id: string;
  label: string;
  /** A unit that never changes, or the display scale the unit and the conversion come from; neither for a plain number. */
  unit?: string;
  scale?: SettingScale;
  hint?: string;
}

/** One row per numeric setting; the bounds are the shared schema's (formulaSettingsSchema), checked on every change. */
const NUMERIC_SETTINGS: Record<NumericSettingKey, NumericSetting> = {
  targetSolids: { name: 'settings.targetSolidsPct', id: 'setting-targetSolidsPct', label: 'Target final soluble solids', unit: '%' },
  jarFill: { name: 'settings.jarNetFillG', id: 'setting-jarNetFill', label: 'Jar net fill', scale: 'jarFill' },
  plannedPh: { name: 'settings.plannedPh', id: 'setting-plannedPh', label: 'Planned pH (optional)' },
  sucroseInversion: {
    name: 'settings.sucroseInversionPct',
    id: 'setting-sucroseInversion',
    label: 'Sucrose inverted in the boil',
    unit: '%',
    hint: 'Optional, for the water-activity estimate: acid and a long boil split sucrose into glucose and fructose. Leave empty to assume none; the estimate then errs high, on the safe side.',
  },
  altitude: { name: 'settings.altitudeM', id: 'setting-altitude', label: 'Kitchen altitude', scale: 'altitude', hint: 'Leave empty for sea level.' },
  measuredBoiling: {
    name: 'settings.measuredWaterBoilingC',
    id: 'setting-measuredBoiling',
    label: 'Measured water boiling point',
    scale: 'boiling',
    hint: "Boil plain water in your pan and read the thermometer; it captures the day's weather too.",
  },
};
/** Shown in the grid, in this order; the boiling point's two ways sit in their own fieldset. */
const GRID_SETTINGS: NumericSettingKey[] = ['targetSolids', 'jarFill', 'plannedPh', 'sucroseInversion'];
const BOILING_SETTING: Record<SettingsDraft['boilingReference'], NumericSettingKey> = { altitude: 'altitude', measured: 'measuredBoiling' };

/** A typed value that is not a number, before the server is asked. */
function numberProblem(draft: MeasuredDraft): string[] {
  return draft.base !== null && Number.isNaN(draft.base) ? [isAmbiguousComma(draft.text) ? unreadableNumberMessage(draft.text) : 'Enter a number.'] : [];
}

/** The formula's settings: product class, rules, solids target, jar, pH, preservation and where water boils. */
export function SettingsCard({
  settings,
  system,
  temperatureUnit,
  errors,
  liveErrors = {},
  onChange,
}: {
  settings: SettingsDraft;
  system: UnitPreference;
  temperatureUnit: TemperatureUnit;
  /** Field errors by key (`settings.…`), from the shared schema at save or the server. */
  errors: Record<string, string[] | undefined>;
  /** The shared schema's errors of the settings as typed (computeEditor), shown before any save. */
  liveErrors?: Record<string, string[] | undefined>;
  /** A change to the settings; `errorKey` names the field whose error it clears. */
  onChange: (patch: Partial<SettingsDraft>, errorKey?: string) => void;
}) {
  const scales: Record<SettingScale, DisplayScale> = { jarFill: jarFillScale(system), altitude: altitudeScale(system), boiling: temperatureScale(temperatureUnit) };
  const fieldErrors = (key: string, draft?: MeasuredDraft) => {
    // An unreadable number says so itself; the schema's "must be a number" would only repeat it.
    const typed = draft ? numberProblem(draft) : [];
    const list = [...new Set([...typed, ...(typed.length ? [] : (liveErrors[key] ?? [])), ...(errors[key] ?? [])])];
    return list.length ? list : undefined;
  };
  const updateSettings = onChange;
  const numericField = (key: NumericSettingKey) => {
    const setting = NUMERIC_SETTINGS[key];
    const scale = setting.scale ? scales[setting.scale] : null;
    const unit = scale ? scale.unitLabel : setting.unit;
    const draft = settings[key];
    return (
      <Field
        key={key}
        label={unit ? `${setting.label} (${unit})` : setting.label}
        name={setting.name}
        id={setting.id}
        inputMode="decimal"
        value={draft.text}
        onChange={(e) => updateSettings({ [key]: scale ? draftFromText(e.target.value, scale) : settingsTextToDraft(e.target.value) }, setting.name)}
        errors={fieldErrors(setting.name, draft)}
        hint={setting.hint}
      />
    );
  };
  return (
    <Card title="Settings">
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField
          label="Product class"
          name="settings.productClass"
          id="setting-productClass"
          value={settings.productClass}
          options={productClassOptions}
          onChange={(e) => updateSettings({ productClass: e.target.value as SettingsDraft['productClass'] }, 'settings.productClass')}
          errors={errors['settings.productClass']}
        />
        <SelectField
          label="Market rule set"
          name="settings.ruleSet"
          id="setting-ruleSet"
          value={settings.ruleSet}
          options={ruleSetOptions}
          onChange={(e) => updateSettings({ ruleSet: e.target.value as SettingsDraft['ruleSet'] }, 'settings.ruleSet')}
          errors={errors['settings.ruleSet']}
        />
        <Field
          label="Rule date (production or labelling)"
          name="settings.ruleDate"
          id="setting-ruleDate"
          type="date"
          value={settings.ruleDate}
          min={RULE_DATE_MIN}
          max={RULE_DATE_MAX}
          onChange={(e) => updateSettings({ ruleDate: e.target.value }, 'settings.ruleDate')}
          errors={fieldErrors('settings.ruleDate')}
          hint="Selects the edition of the rules, e.g. the EU minimums that change on 14 June 2026."
        />
        {GRID_SETTINGS.map(numericField)}
        <SelectField
          label="Preservation besides sugar"
          name="settings.preservation"
          id="setting-preservation"
          value={settings.preservation}
          options={preservationOptions}
          onChange={(e) => updateSettings({ preservation: e.target.value as SettingsDraft['preservation'] }, 'settings.preservation')}
          errors={errors['settings.preservation']}
        />
        <fieldset className="sm:col-span-2">
          <legend className="mb-1 text-sm font-medium text-rind-700">Where does water boil in your kitchen?</legend>
          <div className="flex flex-wrap gap-x-6 gap-y-1">
            <label className="inline-flex min-h-10 items-center gap-2 text-sm">
              <input
                type="radio"
                name="boilingReference"
                value="altitude"
                checked={settings.boilingReference === 'altitude'}
                onChange={() => updateSettings({ boilingReference: 'altitude' }, 'settings.measuredWaterBoilingC')}
              />
              From the kitchen altitude
            </label>
            <label className="inline-flex min-h-10 items-center gap-2 text-sm">
              <input
                type="radio"
                name="boilingReference"
                value="measured"
                checked={settings.boilingReference === 'measured'}
                onChange={() => updateSettings({ boilingReference: 'measured' }, 'settings.altitudeM')}
              />
              I measured it
            </label>
          </div>
          <div className="mt-2 max-w-xs">
            {numericField(BOILING_SETTING[settings.boilingReference])}
          </div>
        </fieldset>
      </div>
    </Card>
  );
}
