'use client';

import { PRESERVATION_LABELS, PRESERVATION_METHODS, type UnitPreference } from '@/lib/chemistry';
import { PRODUCT_CLASS_LABELS, PRODUCT_CLASSES, RULE_SET_LABELS, RULE_SETS } from '@/lib/formulas/schema';
import { altitudeScale, draftFromText, jarFillScale, temperatureScale, type MeasuredDraft, type TemperatureUnit } from '@/lib/format/quantities';
import { Card } from '@/components/ui/Card';
import { Field, SelectField } from '@/components/ui/Field';
import { settingsTextToDraft, type SettingsDraft } from '../editor-state';

const productClassOptions = PRODUCT_CLASSES.map((c) => ({ value: c, label: PRODUCT_CLASS_LABELS[c] }));
const ruleSetOptions = RULE_SETS.map((r) => ({ value: r, label: RULE_SET_LABELS[r] }));
const preservationOptions = [{ value: '', label: 'Not stated (sugar and acidity alone)' }, ...PRESERVATION_METHODS.map((m) => ({ value: m, label: PRESERVATION_LABELS[m] }))];

/** A typed value that is not a number, before the server is asked. */
function numberProblem(draft: MeasuredDraft): string[] {
  return draft.base !== null && Number.isNaN(draft.base) ? ['Enter a number.'] : [];
}

/** The formula's settings: product class, rules, solids target, jar, pH, preservation and where water boils. */
export function SettingsCard({
  settings,
  system,
  temperatureUnit,
  errors,
  onChange,
}: {
  settings: SettingsDraft;
  system: UnitPreference;
  temperatureUnit: TemperatureUnit;
  /** Field errors by key (`settings.…`), from the shared schema or the server. */
  errors: Record<string, string[] | undefined>;
  /** A change to the settings; `errorKey` names the field whose error it clears. */
  onChange: (patch: Partial<SettingsDraft>, errorKey?: string) => void;
}) {
  const jarScale = jarFillScale(system);
  const altScale = altitudeScale(system);
  const bpScale = temperatureScale(temperatureUnit);
  const fieldErrors = (key: string, draft?: MeasuredDraft) => {
    const list = [...(draft ? numberProblem(draft) : []), ...(errors[key] ?? [])];
    return list.length ? list : undefined;
  };
  const updateSettings = onChange;
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
          onChange={(e) => updateSettings({ ruleDate: e.target.value }, 'settings.ruleDate')}
          errors={errors['settings.ruleDate']}
          hint="Selects the edition of the rules, e.g. the EU minimums that change on 14 June 2026."
        />
        <Field
          label="Target final soluble solids (%)"
          name="settings.targetSolidsPct"
          id="setting-targetSolidsPct"
          inputMode="decimal"
          value={settings.targetSolids.text}
          onChange={(e) => updateSettings({ targetSolids: settingsTextToDraft(e.target.value) }, 'settings.targetSolidsPct')}
          errors={fieldErrors('settings.targetSolidsPct', settings.targetSolids)}
        />
        <Field
          label={`Jar net fill (${jarScale.unitLabel})`}
          name="settings.jarNetFillG"
          id="setting-jarNetFill"
          inputMode="decimal"
          value={settings.jarFill.text}
          onChange={(e) => updateSettings({ jarFill: draftFromText(e.target.value, jarScale) }, 'settings.jarNetFillG')}
          errors={fieldErrors('settings.jarNetFillG', settings.jarFill)}
        />
        <Field
          label="Planned pH (optional)"
          name="settings.plannedPh"
          id="setting-plannedPh"
          inputMode="decimal"
          value={settings.plannedPh.text}
          onChange={(e) => updateSettings({ plannedPh: settingsTextToDraft(e.target.value) }, 'settings.plannedPh')}
          errors={fieldErrors('settings.plannedPh', settings.plannedPh)}
        />
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
            {settings.boilingReference === 'altitude' ? (
              <Field
                label={`Kitchen altitude (${altScale.unitLabel})`}
                name="settings.altitudeM"
                id="setting-altitude"
                inputMode="decimal"
                value={settings.altitude.text}
                onChange={(e) => updateSettings({ altitude: draftFromText(e.target.value, altScale) }, 'settings.altitudeM')}
                errors={fieldErrors('settings.altitudeM', settings.altitude)}
                hint="Leave empty for sea level."
              />
            ) : (
              <Field
                label={`Measured water boiling point (${bpScale.unitLabel})`}
                name="settings.measuredWaterBoilingC"
                id="setting-measuredBoiling"
                inputMode="decimal"
                value={settings.measuredBoiling.text}
                onChange={(e) => updateSettings({ measuredBoiling: draftFromText(e.target.value, bpScale) }, 'settings.measuredWaterBoilingC')}
                errors={fieldErrors('settings.measuredWaterBoilingC', settings.measuredBoiling)}
                hint="Boil plain water in your pan and read the thermometer; it captures the day's weather too."
              />
            )}
          </div>
        </fieldset>
      </div>
    </Card>
  );
}
