/**
 * A cook's values are listed once (COOK_VALUE_FIELDS, from the schema): storing, viewing and
 * correcting copy exactly that list, so a new reading is added in the entity, the schema and the form.
 */
import { describe, expect, it } from 'vitest';
import { Cook } from '@/entities/Cook';
import { COOK_VALUE_FIELDS, cookValues } from '@/lib/trials/schema';
import { cookColumns } from '@/lib/trials/mutations';
import { COOK_CSV_COLUMNS } from '@/lib/trials/csv';

const BOOKKEEPING = ['id', 'workspace', 'variant', 'cookDate', 'recordedBy', 'createdAt', 'withdrawnAt'];

describe('the fields of a cook', () => {
  it('every stored value column of a cook is in the schema’s list, and nothing else', () => {
    const stored = Object.keys(Cook.meta.properties).filter((k) => !BOOKKEEPING.includes(k));
    expect([...COOK_VALUE_FIELDS].sort()).toEqual(stored.sort());
  });

  it('every listed value travels through CSV import and export', () => {
    expect(COOK_CSV_COLUMNS.map((c) => c.field as string).filter((f) => f !== 'cookDate' && f !== 'variant').sort()).toEqual([...COOK_VALUE_FIELDS].sort());
  });

  it('absent values become null, given ones are kept, unknown keys are dropped', () => {
    const v = cookValues({ ph: 3.1, yieldG: 0, ...({ evil: 1 } as object) });
    expect(v.ph).toBe(3.1);
    expect(v.yieldG).toBe(0);
    expect(v.brixReading).toBeNull();
    expect('evil' in v).toBe(false);
    expect(cookColumns({ cookDate: '2026-12-01', ph: 3.1 })).toEqual({ cookDate: '2026-12-01', ...v, yieldG: null });
  });
});
