/** The one check of a label input, shared by every label module. PURE. */
import { ChemistryInputError, requireFiniteNumber } from '@/lib/chemistry/errors';
import type { LabelInput } from './types';

/** Refuses a label input the modules cannot work with (a 4xx for the API), naming the field. */
export function validateLabelInput(input: LabelInput): void {
  if (!input || !Array.isArray(input.lines)) throw new ChemistryInputError('lines', 'the label needs the formula lines');
  if (!input.settings || typeof input.settings !== 'object') throw new ChemistryInputError('settings', 'settings are missing');
  const finished = requireFiniteNumber(input.massBalance?.finishedMassG, 'massBalance.finishedMassG');
  if (finished <= 0) throw new ChemistryInputError('massBalance.finishedMassG', 'finished mass must be positive');
  input.lines.forEach((line, i) => {
    const grams = requireFiniteNumber(line?.grams, `lines[${i}].grams`);
    if (grams < 0) throw new ChemistryInputError(`lines[${i}].grams`, 'grams cannot be negative');
    const name = line.ingredient?.labelName;
    if (typeof name !== 'string' || name.trim() === '') {
      throw new ChemistryInputError(`lines[${i}].ingredient.labelName`, 'every line needs its ingredient-list name');
    }
  });
}
