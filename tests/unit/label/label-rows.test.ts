import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { labelChanges, labelRows } from '@/lib/label/label';
import { labelCsv } from '@/lib/label/export';
import { sampleLabel } from './sample-label';

describe('label rows and changes', () => {
  it('finds no change between a label and itself', () => {
    expect(labelChanges(sampleLabel(), sampleLabel())).toEqual([]);
  });

  it('ignores a change of the unrounded figure that rounds to the same label text', () => {
    const after = sampleLabel();
    after.eu.rows[0].unrounded = 771.2;
    expect(labelChanges(sampleLabel(), after)).toEqual([]);
  });

  it('names each row whose label text changes, with before and after', () => {
    const after = sampleLabel();
    after.eu.rows[5] = { ...after.eu.rows[5], unrounded: 39.8, label: '40 g' };
    after.additives[0] = { ...after.additives[0], status: 'within', amount: '900 mg/kg as sorbic acid' };
    const changes = labelChanges(sampleLabel(), after);
    expect(changes).toEqual([
      { section: 'EU declaration, 100 g', item: 'of which sugars', before: '44 g', after: '40 g', printed: true },
      { section: 'Additive limits', item: 'Sorbic acid and sorbates', before: '1100 mg/kg as sorbic acid (over: 1000 mg/kg)', after: '900 mg/kg as sorbic acid (within: 1000 mg/kg)', printed: false },
    ]);
  });

  it('reports rows that appear or go away', () => {
    const after = sampleLabel();
    after.additives = [];
    after.claims.items.push({ claim: 'Low sugars', holds: false, figures: '44.1 g per 100 g; at most 5 g', rule: 'Regulation (EC) 1924/2006, Annex' });
    const changes = labelChanges(sampleLabel(), after);
    expect(changes).toContainEqual({ section: 'Claims', item: 'Low sugars', before: null, after: 'may not be made', printed: false });
    expect(changes).toContainEqual({ section: 'Additive limits', item: 'Sorbic acid and sorbates', before: '1100 mg/kg as sorbic acid (over: 1000 mg/kg)', after: null, printed: false });
  });

  it('exports every row to CSV with the unrounded figure, unknowns left as "unknown"', () => {
    const label = sampleLabel();
    const parsed = Papa.parse<string[]>(labelCsv(label).trim()).data;
    expect(parsed[0]).toEqual(['section', 'item', 'value', 'unrounded']);
    expect(parsed.length - 1).toBe(labelRows(label).length + label.incomplete.length);
    expect(parsed).toContainEqual(['EU declaration, 100 g', 'Fat', '<0.5 g', '0.12']);
    expect(parsed).toContainEqual(['EU declaration, 100 g', 'of which saturates', 'unknown', '']);
    expect(parsed).toContainEqual(['Incomplete', 'Saturates', 'Not known for pectin.', '']);
  });
});
