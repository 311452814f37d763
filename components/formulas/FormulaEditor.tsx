'use client';

import { useMemo, useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import type { UnitPreference } from '@/lib/chemistry';
import { createFormulaAction, reviseFormulaAction } from '@/lib/formulas/actions';
import { createFormulaSchema, reviseFormulaSchema, type FormulaSettingsInput } from '@/lib/formulas/schema';
import type { EditorIngredient } from '@/lib/ingredients/schema';
import { Button } from '@/components/ui/Button';
import { Card } from '@/components/ui/Card';
import { Field, FieldErrorText } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { Skeleton } from '@/components/ui/Skeleton';
import { useHydrated } from '@/components/ui/useHydrated';
import { BrixHelper } from './BrixHelper';
import { ResultsPanel } from './ResultsPanel';
import { ScalePanel } from './ScalePanel';
import { LiveLabel } from '@/components/label/LiveLabel';
import { KeyResultsBar } from './editor/KeyResultsBar';
import { PredictionPanel, PredictionSummary } from './PredictionPanel';
import type { EditorFamilyModel } from '@/lib/modelling/schema';
import { LineRow } from './editor/LineRow';
import { UnitToggle } from './editor/UnitToggle';
import { FormulaCostPanel } from '@/components/costs/FormulaCostPanel';
import type { EditorCostBasis } from '@/lib/costs/schema';
import { useUnsavedWarning } from '@/components/ui/useUnsavedWarning';
import { computeEditor, convertLineForSystem, convertSettingsForSystem, convertSettingsForTemperature, EMPTY_FIELD_ERRORS, hasFieldErrors, ingredientIndex, initialSettingsDraft, issuesToFieldErrors, lineDraftFromStored, linesForSave, mapFieldErrors, moveItem, newLineDraft, settingsFromDraft, type LineDraft, type MappedFieldErrors, type SettingsDraft } from './editor-state';
import { showMass, type TemperatureUnit } from '@/lib/format/quantities';
import { SettingsCard } from './editor/SettingsCard';

export interface FormulaEditorProps {
  mode: 'create' | 'revise';
  initial?: {
    formulaId: string;
    name: string;
    revision: number;
    settings: FormulaSettingsInput;
    lines: Array<{ ingredientId: string; quantity: number; unit: 'g' | 'pct_fruit' }>;
  };
  /** Workspace library, not archived. */
  ingredients: EditorIngredient[];
  massUnits: UnitPreference;
  temperatureUnit: TemperatureUnit;
  /** Settings for a new formula. */
  defaults?: Partial<FormulaSettingsInput>;
  /** Prices for the live cost; absent for roles that may not see prices. */
  cost?: { basis: EditorCostBasis; packFormatId: string | null };
  /** The workspace's fitted family models, for predictions while typing (none: no panel). */
  models?: readonly EditorFamilyModel[];
}

type SaveStatus =
  | { kind: 'idle' }
  | { kind: 'saving' }
  | { kind: 'saved'; revision: number }
  /** `aboutFields`: the message only summarises field errors, so it goes once they are fixed. */
  | { kind: 'error'; message: string; aboutFields?: boolean }
  | { kind: 'conflict'; message: string };

const SYSTEM_OPTIONS = [
  { value: 'metric', label: 'Metric' },
  { value: 'imperial', label: 'Imperial' },
] as const;
const TEMPERATURE_OPTIONS = [
  { value: 'C', label: '°C' },
  { value: 'F', label: '°F' },
] as const;

/** The formula editor: settings, lines and live results; saves a new formula or a new revision. */
export function FormulaEditor({ mode, initial, ingredients, massUnits, temperatureUnit, defaults, cost, models = [] }: FormulaEditorProps) {
  const router = useRouter();
  const hydrated = useHydrated();
  const nextKey = useRef(initial?.lines.length ?? 0);
  const makeKey = () => `l${nextKey.current++}`;

  const [system, setSystem] = useState<UnitPreference>(massUnits);
  const [tempUnit, setTempUnit] = useState<TemperatureUnit>(temperatureUnit);
  const [name, setName] = useState(initial?.name ?? '');
  const [note, setNote] = useState('');
  const [settings, setSettings] = useState<SettingsDraft>(() =>
    initialSettingsDraft({ settings: initial?.settings ?? defaults, system: massUnits, temperatureUnit }),
  );
  const [lines, setLines] = useState<LineDraft[]>(() => (initial?.lines ?? []).map((l, i) => lineDraftFromStored(`l${i}`, l, massUnits)));
  const [lastRemoved, setLastRemoved] = useState<{ line: LineDraft; index: number } | null>(null);
  const [errors, setErrors] = useState<MappedFieldErrors>(EMPTY_FIELD_ERRORS);
  const [status, setStatus] = useState<SaveStatus>({ kind: 'idle' });
  const [baseRevision, setBaseRevision] = useState(initial?.revision ?? 0);
  const [dirty, setDirty] = useState(false);

  const ingredientsById = useMemo(() => ingredientIndex(ingredients), [ingredients]);
  const computed = useMemo(() => computeEditor(settings, lines, ingredientsById), [settings, lines, ingredientsById]);
  const settingsInput = useMemo(() => settingsFromDraft(settings), [settings]);

  useUnsavedWarning(dirty);

  const touched = () => {
    setDirty(true);
    if (status.kind === 'saved') setStatus({ kind: 'idle' });
  };

  const clearFieldError = (key: string) => {
    if (!errors.fields[key]) return;
    const fields = { ...errors.fields };
    delete fields[key];
    setErrors({ ...errors, fields });
  };

  function updateSettings(patch: Partial<SettingsDraft>, errorKey?: string) {
    setSettings((s) => ({ ...s, ...patch }));
    if (errorKey) clearFieldError(errorKey);
    touched();
  }

  function updateLine(index: number, line: LineDraft) {
    setLines((ls) => ls.map((l, i) => (i === index ? line : l)));
    if (errors.lines[line.key]) {
      const rest = { ...errors.lines };
      delete rest[line.key];
      setErrors({ ...errors, lines: rest });
    }
    touched();
  }

  function addLine() {
    setLines((ls) => [...ls, newLineDraft(makeKey(), system)]);
    clearFieldError('lines');
    touched();
  }

  function removeLine(index: number) {
    setLastRemoved({ line: lines[index], index });
    setLines((ls) => ls.filter((_, i) => i !== index));
    touched();
  }

  function undoRemove() {
    if (!lastRemoved) return;
    const { line, index } = lastRemoved;
    // The line comes back in the unit system now on screen.
    const restored = convertLineForSystem(line, system);
    setLines((ls) => [...ls.slice(0, index), restored, ...ls.slice(index)]);
    setLastRemoved(null);
    touched();
  }

  function moveLine(index: number, offset: -1 | 1) {
    setLines((ls) => moveItem(ls, index, offset));
    touched();
  }

  function switchSystem(next: UnitPreference) {
    setSystem(next);
    setLines((ls) => ls.map((l) => convertLineForSystem(l, next)));
    setSettings((s) => convertSettingsForSystem(s, next));
  }

  function switchTemperature(next: TemperatureUnit) {
    setTempUnit(next);
    setSettings((s) => convertSettingsForTemperature(s, next));
  }

  async function save(force = false) {
    const sentKeys = lines.map((l) => l.key);
    const trimmedNote = note.trim();
    const common = { name, settings: settingsInput, lines: linesForSave(lines), ...(trimmedNote ? { note: trimmedNote } : {}) };
    if (mode === 'revise' && !initial) {
      setStatus({ kind: 'error', message: 'There is no saved formula to revise.' });
      return;
    }
    const body = mode === 'create' ? common : { baseRevision, ...common, ...(force ? { force: true } : {}) };

    // The shared schema catches what the server would refuse, before a round trip.
    const check = (mode === 'create' ? createFormulaSchema : reviseFormulaSchema).safeParse(body);
    if (!check.success) {
      setErrors(mapFieldErrors(issuesToFieldErrors(check.error.issues), sentKeys));
      setStatus({ kind: 'error', message: 'Some fields need attention; they are marked below.', aboutFields: true });
      return;
    }

    setStatus({ kind: 'saving' });
    try {
      const result = mode === 'create' || !initial ? await createFormulaAction(body) : await reviseFormulaAction(initial.formulaId, body);
      if (result.ok) {
        setErrors(EMPTY_FIELD_ERRORS);
        setDirty(false);
        setBaseRevision(result.data.revision);
        setStatus({ kind: 'saved', revision: result.data.revision });
        router.push(`/formulas/${result.data.formulaId}`);
        router.refresh();
        return;
      }
      if (result.status === 409 && mode === 'revise') {
        setStatus({ kind: 'conflict', message: result.error });
        return;
      }
      if (result.status === 422) setErrors(mapFieldErrors(result.fields, sentKeys));
      setStatus({ kind: 'error', message: result.error, aboutFields: result.status === 422 && !!result.fields });
    } catch {
      setStatus({ kind: 'error', message: 'The formula was not saved: the server could not be reached. Everything you typed is still here.' });
    }
  }

  const outcome = computed.outcome;
  const massByLineKey = new Map<string, number>();
  if (outcome?.ok) computed.lineKeys.forEach((key, i) => massByLineKey.set(key, outcome.computation.massBalance.lines[i].massG));
  const skipped = computed.skippedLineKeys.length;
  const resultsNotice =
    skipped > 0 ? `${skipped} incomplete line${skipped === 1 ? ' is' : 's are'} left out until it has an ingredient and a quantity.` : undefined;

  const saving = status.kind === 'saving';

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center gap-3">
        <UnitToggle label="Mass units" value={system} options={SYSTEM_OPTIONS} onChange={switchSystem} />
        <UnitToggle label="Temperature unit" value={tempUnit} options={TEMPERATURE_OPTIONS} onChange={switchTemperature} />
        <p className="text-xs text-rind-500">Setwell keeps grams and °C; these only change what you see and type.</p>
      </div>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(20rem,26rem)]">
        <form
          className="space-y-6"
          noValidate
          aria-label={mode === 'create' ? 'New formula' : 'Revise formula'}
          onSubmit={(e) => {
            e.preventDefault();
            void save(false);
          }}
        >
          <Card title="Formula">
            <Field
              label="Name"
              name="name"
              id="formula-name"
              value={name}
              maxLength={120}
              onChange={(e) => {
                setName(e.target.value);
                clearFieldError('name');
                touched();
              }}
              errors={errors.fields.name}
            />
          </Card>

          <SettingsCard settings={settings} system={system} temperatureUnit={tempUnit} errors={errors.fields} liveErrors={computed.settingsErrors} onChange={updateSettings} />

          <Card
            title="Lines"
            actions={
              <Button tone="secondary" type="button" onClick={addLine}>
                Add line
              </Button>
            }
          >
            {ingredients.length === 0 ? (
              <Notice tone="warning">The ingredient library is empty. Add ingredients to the library first.</Notice>
            ) : null}
            {lines.length === 0 ? <p className="text-sm text-rind-600">No lines yet. Add a line for each ingredient, starting with the fruit.</p> : null}
            <ol className="space-y-3" aria-label="Formula lines">
              {lines.map((line, index) => {
                const massG = massByLineKey.get(line.key);
                return (
                  <LineRow
                    key={line.key}
                    line={line}
                    index={index}
                    count={lines.length}
                    ingredients={ingredients}
                    ingredient={ingredientsById.get(line.ingredientId)}
                    errors={errors.lines[line.key]}
                    massHint={line.unit === 'pct_fruit' && massG !== undefined ? `= ${showMass(massG, system)}` : undefined}
                    onChange={(l) => updateLine(index, l)}
                    onRemove={() => removeLine(index)}
                    onMove={(offset) => moveLine(index, offset)}
                  />
                );
              })}
            </ol>
            <FieldErrorText id="lines-err" errors={errors.fields.lines} />
            {lastRemoved ? (
              <div className="mt-3 flex flex-wrap items-center gap-3 text-sm text-rind-600">
                <span>
                  Removed line {lastRemoved.index + 1}
                  {ingredientsById.get(lastRemoved.line.ingredientId) ? ` (${ingredientsById.get(lastRemoved.line.ingredientId)?.name})` : ''}.
                </span>
                <Button tone="ghost" type="button" onClick={undoRemove}>
                  Undo remove
                </Button>
              </div>
            ) : null}
          </Card>

          <Card title="Save">
            <div className="space-y-4">
              <Field
                label={mode === 'create' ? 'Note (optional)' : 'What changed (short note)'}
                name="note"
                id="formula-note"
                value={note}
                maxLength={500}
                onChange={(e) => {
                  setNote(e.target.value);
                  clearFieldError('note');
                  touched();
                }}
                errors={errors.fields.note}
              />
              {status.kind === 'saved' ? <Notice tone="success">Saved as revision {status.revision}.</Notice> : null}
              {status.kind === 'error' && !(status.aboutFields && !hasFieldErrors(errors)) ? (
                <Notice tone="danger" title="Not saved">
                  <p>{status.message}</p>
                  {errors.unplaced.length ? (
                    <ul className="mt-1 list-disc pl-5">
                      {errors.unplaced.map((m, i) => (
                        <li key={i}>{m}</li>
                      ))}
                    </ul>
                  ) : null}
                </Notice>
              ) : null}
              {status.kind === 'conflict' ? (
                <Notice tone="warning" title="Someone saved a newer revision">
                  <p>{status.message}</p>
                  <p className="mt-1">Everything you typed is still here. Saving yours on top keeps both revisions in the history.</p>
                  <div className="mt-3">
                    <Button type="button" tone="secondary" disabled={saving} onClick={() => void save(true)}>
                      Save mine on top anyway
                    </Button>
                  </div>
                </Notice>
              ) : null}
              <Button type="submit" disabled={saving}>
                {saving ? 'Saving…' : mode === 'create' ? 'Save formula' : 'Save new revision'}
              </Button>
            </div>
          </Card>
          <KeyResultsBar outcome={outcome} massUnits={system} temperatureUnit={tempUnit} resultsAnchor="batch-results">
            <PredictionSummary models={models} computed={computed} drafts={lines} settings={settingsInput} />
          </KeyResultsBar>
        </form>

        <aside id="batch-results" className="scroll-mt-4 self-start lg:sticky lg:top-4">
          {models.length ? <Card className="mb-4"><PredictionPanel models={models} computed={computed} drafts={lines} settings={settingsInput} /></Card> : null}
          <Card>
            <ResultsPanel outcome={outcome} massUnits={system} temperatureUnit={tempUnit} notice={resultsNotice} />
          </Card>
        </aside>
      </div>

      {/* Below the lines and their results: drawn by the browser once the script runs (a placeholder
          until then). They are live panels the browser recomputes on every keystroke anyway, and
          rendering them on the server too was a third of the editor's HTML. */}
      {hydrated ? (
        <>
          {cost ? (
            <Card>
              <FormulaCostPanel initialBasis={cost.basis} computed={computed} drafts={lines} packFormatId={cost.packFormatId} massUnits={system} />
            </Card>
          ) : null}

          <div className="grid gap-6 xl:grid-cols-2">
            <Card>
              {outcome?.ok ? (
                <ScalePanel lines={computed.lines} settings={settingsInput} massUnits={system} />
              ) : (
                <p className="text-sm text-rind-600">Scaling opens once the formula has results.</p>
              )}
            </Card>
            <Card>
              <BrixHelper temperatureUnit={tempUnit} />
            </Card>
          </div>

          <Card>
            <LiveLabel settings={settingsInput} outcome={outcome} lines={computed.lines} />
          </Card>
        </>
      ) : (
        <Skeleton what={cost ? 'the cost, scaling and label' : 'the scaling and label'} lines={6} />
      )}
    </div>
  );
}
