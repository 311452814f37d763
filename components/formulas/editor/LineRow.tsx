'use client';

import type { LineUnit } from '@/lib/chemistry';
import { LINE_UNITS } from '@/lib/formulas/schema';
import type { EditorIngredient } from '@/lib/ingredients/schema';
import { FieldErrorText, inputClass } from '@/components/ui/Field';
import { isAmbiguousComma, unreadableNumberMessage } from '@/lib/format/numbers';
import { Button } from '@/components/ui/Button';
import { IngredientPicker } from './IngredientPicker';
import { LINE_UNIT_LABELS, setLineText, setLineUnit, type LineDraft, type LineField } from '../editor-state';

export interface LineRowProps {
  line: LineDraft;
  index: number;
  count: number;
  ingredients: EditorIngredient[];
  ingredient: EditorIngredient | undefined;
  errors?: Partial<Record<LineField, string[]>>;
  /** The line's mass as the computation resolved it, e.g. "= 60.0 g" for a % of fruit line. */
  massHint?: string;
  onChange: (line: LineDraft) => void;
  onRemove: () => void;
  onMove: (offset: -1 | 1) => void;
}

export function LineRow({ line, index, count, ingredients, ingredient, errors, massHint, onChange, onRemove, onMove }: LineRowProps) {
  const base = `line-${line.key}`;
  const number = index + 1;
  const localQuantityError = line.base !== null && Number.isNaN(line.base) ? [isAmbiguousComma(line.text) ? unreadableNumberMessage(line.text) : 'Enter a number, e.g. 250 or 1.5.'] : [];
  const quantityErrors = [...localQuantityError, ...(errors?.quantity ?? [])];
  const ingredientErrors = errors?.ingredientId ?? [];
  const unitErrors = errors?.unit ?? [];
  const isFruit = ingredient?.kind === 'fruit';
  const errorId = (field: string) => `${base}-${field}-err`;

  return (
    <li className="rounded-lg bg-white p-3 ring-1 ring-pith-300" data-testid={`line-${index}`}>
      <div className="grid gap-3 sm:grid-cols-[minmax(0,1fr)_8rem_8.5rem] sm:items-start">
        <div>
          <label htmlFor={`${base}-ingredient`} className="mb-1 block text-xs font-medium text-rind-600">
            Line {number}: ingredient
          </label>
          <IngredientPicker
            id={`${base}-ingredient`}
            value={line.ingredientId}
            ingredients={ingredients}
            onChange={(ingredientId) => onChange({ ...line, ingredientId })}
            invalid={ingredientErrors.length > 0}
            describedBy={ingredientErrors.length ? errorId('ingredient') : undefined}
          />
          <FieldErrorText id={errorId('ingredient')} errors={ingredientErrors} />
        </div>
        <div>
          <label htmlFor={`${base}-quantity`} className="mb-1 block text-xs font-medium text-rind-600">
            Line {number}: quantity
          </label>
          <input
            id={`${base}-quantity`}
            inputMode="decimal"
            autoComplete="off"
            value={line.text}
            onChange={(e) => onChange(setLineText(line, e.target.value))}
            aria-invalid={quantityErrors.length ? true : undefined}
            aria-describedby={quantityErrors.length ? errorId('quantity') : massHint ? `${base}-mass` : undefined}
            className={`${inputClass} min-h-10 tabular-nums`}
          />
          {massHint && !quantityErrors.length ? (
            <p id={`${base}-mass`} className="mt-1 text-xs text-rind-500">
              {massHint}
            </p>
          ) : null}
          <FieldErrorText id={errorId('quantity')} errors={quantityErrors} />
        </div>
        <div>
          <label htmlFor={`${base}-unit`} className="mb-1 block text-xs font-medium text-rind-600">
            Line {number}: unit
          </label>
          <select
            id={`${base}-unit`}
            value={line.unit}
            onChange={(e) => onChange(setLineUnit(line, e.target.value as LineUnit))}
            aria-invalid={unitErrors.length ? true : undefined}
            aria-describedby={unitErrors.length ? errorId('unit') : undefined}
            className={`${inputClass} min-h-10`}
          >
            {LINE_UNITS.map((u) => (
              <option key={u} value={u} disabled={u === 'pct_fruit' && isFruit}>
                {LINE_UNIT_LABELS[u]}
              </option>
            ))}
          </select>
          <FieldErrorText id={errorId('unit')} errors={unitErrors} />
        </div>
      </div>
      <div className="mt-2 flex flex-wrap justify-end gap-1">
        <Button tone="ghost" type="button" onClick={() => onMove(-1)} disabled={index === 0} aria-label={`Move line ${number} up`}>
          ↑ Up
        </Button>
        <Button tone="ghost" type="button" onClick={() => onMove(1)} disabled={index === count - 1} aria-label={`Move line ${number} down`}>
          ↓ Down
        </Button>
        <Button tone="ghost" type="button" onClick={onRemove} aria-label={`Remove line ${number}`}>
          Remove
        </Button>
      </div>
    </li>
  );
}
