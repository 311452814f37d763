/** Cook readings that cannot be true are refused (a walk recorded a cook dated 2099 and 90 kg of jam from a 1.5 kg charge). */
import { describe, expect, it } from 'vitest';
import { cookReadingProblems } from '@/lib/trials/schema';
import { addDaysIso } from '@/lib/format/dates';

const today = '2026-12-04';
const paths = (m: Parameters<typeof cookReadingProblems>[0]) => cookReadingProblems(m, today).map((p) => `${p.path}: ${p.message}`);

describe('cook rules', () => {
  it('refuses a cook dated after tomorrow (a day of slack for time zones)', () => {
    expect(paths({ cookDate: '2099-12-31', ph: 3.2 })).toEqual(['cookDate: A cook cannot be dated in the future.']);
    expect(paths({ cookDate: '2026-12-06', ph: 3.2 })).toEqual(['cookDate: A cook cannot be dated in the future.']);
    expect(paths({ cookDate: '2026-12-05', ph: 3.2 })).toEqual([]);
    expect(paths({ cookDate: '2026-11-20', ph: 3.2 })).toEqual([]);
  });

  it('refuses a yield above the batch size: boiling only takes water away', () => {
    expect(paths({ cookDate: today, batchSizeG: 1500, yieldG: 90_000 })).toEqual(['yieldG: The yield cannot be more than the batch size: boiling only takes water away. Check both.']);
    expect(paths({ cookDate: today, batchSizeG: 1500, yieldG: 1150 })).toEqual([]);
    expect(paths({ cookDate: today, yieldG: 90_000 })).toEqual([]);
  });

  it('adds calendar days across month and year ends', () => {
    expect(addDaysIso('2026-12-31', 1)).toBe('2027-01-01');
    expect(addDaysIso('2028-02-28', 1)).toBe('2028-02-29');
    expect(addDaysIso('2026-03-01', -1)).toBe('2026-02-28');
  });
});
