/**
 * The formula editor receives the library without its provenance texts and edit history
 * (editorIngredientOf): everything the chemistry, the label and the picker read is kept.
 */
import { describe, it, expect } from 'vitest';
import { editorIngredientOf, type IngredientView } from '@/lib/ingredients/schema';
import { emptyLabelFields, toLabelData } from '@/lib/ingredients/label-data';

const apricot: IngredientView = {
  id: '0b1e6a52-3f0c-4c1a-9a53-5d1a3c9e0101',
  kind: 'fruit', name: 'Apricot pulp', solidsPct: 11.5, phMin: 3.3, phMax: 4.0, pectinLevel: 'low', euFruitGroup: 'general',
  sugars: { sucroseG: 5.87, glucoseG: 2.37, fructoseG: 0.94 },
  origin: 'edited',
  source: 'Invented provenance text for the test, long enough to matter on the wire',
  notes: 'A note of the workspace',
  labelData: { ...emptyLabelFields(), labelName: 'apricots', source: 'Invented composition source', euAllergens: [], sulphiteMgPerKg: 12 },
  archived: false,
  updatedAt: '2026-11-20T09:00:00.000Z',
  updatedByName: 'Demo Maker',
};

describe('editorIngredientOf', () => {
  it('leaves out only the provenance and the edit history', () => {
    const cut = editorIngredientOf(apricot);
    expect(Object.keys(cut).sort()).toEqual(Object.keys(apricot).filter((k) => !['origin', 'source', 'notes', 'updatedAt', 'updatedByName'].includes(k)).sort());
    expect(cut).toMatchObject({ id: apricot.id, kind: 'fruit', name: 'Apricot pulp', solidsPct: 11.5, phMin: 3.3, phMax: 4.0, pectinLevel: 'low', euFruitGroup: 'general', sugars: apricot.sugars, archived: false });
    expect(cut.labelData).not.toHaveProperty('source');
    const { source: _source, ...label } = apricot.labelData;
    void _source;
    expect(cut.labelData).toEqual(label);
    expect(JSON.stringify(cut)).not.toContain('Invented');
  });

  it('gives the label the same data, with no source', () => {
    const full = toLabelData(apricot);
    expect(toLabelData(editorIngredientOf(apricot))).toEqual({ ...full, source: null });
  });
});
