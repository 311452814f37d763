'use client';

import { useMemo, useState } from 'react';
import { INGREDIENT_KINDS, KIND_LABELS, type EditorIngredient } from '@/lib/ingredients/schema';
import { inputClass } from '@/components/ui/Field';

/** Ingredients grouped by kind in <optgroup>s, names in alphabetical order; a native select stays keyboard- and phone-friendly. */
export function groupIngredients(ingredients: EditorIngredient[]): Array<{ kind: (typeof INGREDIENT_KINDS)[number]; label: string; items: EditorIngredient[] }> {
  return INGREDIENT_KINDS.map((kind) => ({
    kind,
    label: KIND_LABELS[kind],
    items: ingredients.filter((i) => i.kind === kind).sort((a, b) => a.name.localeCompare(b.name)),
  })).filter((g) => g.items.length > 0);
}

function optionText(i: EditorIngredient): string {
  return `${i.name} (${i.solidsPct} % solids)`;
}

/**
 * A native select (keyboard and phone pickers for free) whose list is built only when it is about
 * to open: focus (Tab, a screen reader's focus), a pointer press or a key. Until then it holds just
 * the chosen ingredient, so a formula of 40 lines sends and builds one list, not 40 copies of the
 * library. Pointer and focus events come before the browser opens its picker, and React applies
 * the state they set at once, so the list is there when it opens.
 */
export function IngredientPicker({
  id,
  value,
  ingredients,
  onChange,
  invalid,
  describedBy,
}: {
  id: string;
  value: string;
  ingredients: EditorIngredient[];
  onChange: (ingredientId: string) => void;
  invalid?: boolean;
  describedBy?: string;
}) {
  const [listed, setList] = useState(false);
  const groups = useMemo(() => (listed ? groupIngredients(ingredients) : []), [listed, ingredients]);
  const chosen = value === '' ? undefined : ingredients.find((i) => i.id === value);
  const list = () => setList(true);
  return (
    <select
      id={id}
      value={value}
      onChange={(e) => onChange(e.target.value)}
      onFocus={list}
      onPointerDown={list}
      onKeyDown={list}
      aria-invalid={invalid ? true : undefined}
      aria-describedby={describedBy}
      className={`${inputClass} min-h-10`}
    >
      <option value="">Choose an ingredient…</option>
      {value !== '' && !chosen ? <option value={value}>Not in the library any more (archived?)</option> : null}
      {listed
        ? groups.map((g) => (
            <optgroup key={g.kind} label={g.label}>
              {g.items.map((i) => (
                <option key={i.id} value={i.id}>
                  {optionText(i)}
                </option>
              ))}
            </optgroup>
          ))
        : chosen ? <option value={chosen.id}>{optionText(chosen)}</option> : null}
    </select>
  );
}
