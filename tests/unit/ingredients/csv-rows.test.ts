import { describe, expect, it } from 'vitest';
import { ingredientsToCsv, parseIngredientCsv } from '@/lib/ingredients/csv';
import { typicalRow } from '../formulas-library/fixtures';

describe('ingredient CSV rows that name the same ingredient twice', () => {
  it('names the column that matched them: the name when the file has no id column', () => {
    const library = [typicalRow('strawberry', { name: 'Walk plum' })];
    const exported = ingredientsToCsv(library).trim().split(/\r?\n/);
    const header = exported[0].split(',');
    const withoutId = (line: string) => line.split(',').filter((_, i) => header[i] !== 'id').join(',');
    const csv = [withoutId(exported[0]), withoutId(exported[1]), withoutId(exported[1])].join('\n');
    const { errors } = parseIngredientCsv(csv, library);
    expect(errors).toEqual([{ row: 3, column: 'name', message: 'Row 2 already gives this ingredient.' }]);
  });

  it('names the id column when the file matched them by id', () => {
    const library = [typicalRow('strawberry', { name: 'Walk plum' })];
    const exported = ingredientsToCsv(library).trim().split(/\r?\n/);
    const { errors } = parseIngredientCsv([exported[0], exported[1], exported[1]].join('\n'), library);
    expect(errors).toEqual([{ row: 3, column: 'id', message: 'Row 2 already gives this ingredient.' }]);
  });
});
