'use client';

import { INGREDIENT_KINDS, KIND_LABELS, type IngredientView } from '@/lib/ingredients/schema';
import { inputClass } from '@/components/ui/Field';

/** Ingredients grouped by kind in <optgroup>s, names in alphabetical order; a native select stays keyboard- and phone-friendly. */
export function groupIngredients(ingredients: IngredientView[]): Array<{ kind: (typeof INGREDIENT_KINDS)[number]; label: string; items: IngredientView[] }> {
  return INGREDIENT_KINDS.map((kind) => ({
    kind,
    label: KIND_LABELS[kind],
    items: ingredients.filter((i) => i.kind === kind).sort((a, b) => a.name.localeCompare(b.name)),
  })).filter((g) => g.items.length > 0);
}

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
  ingredients: IngredientView[];
  onChange: (ingredientId: string) => void;
  invalid?: boolean;
  describedBy?: string;
}) {
  const known = value === '' || ingredients.some((i) => i.id === value);
  return (
    <select
      id={id}
      value={value}
      onChange={(e) => onChange(e.target.value)}
      aria-invalid={invalid ? true : undefined}
      aria-describedby={describedBy}
      className={`${inputClass} min-h-10`}
    >
      <option value="">Choose an ingredient…</option>
      {known ? null : <option value={value}>Not in the library any more (archived?)</option>}
      {groupIngredients(ingredients).map((g) => (
        <optgroup key={g.kind} label={g.label}>
          {g.items.map((i) => (
            <option key={i.id} value={i.id}>
              {i.name} ({i.solidsPct} % solids)
            </option>
          ))}
        </optgroup>
      ))}
    </select>
  );
}
