import { describe, expect, it } from 'vitest';
import { historiesBy, isSortedHistory, priceOn, sortHistory } from '@/lib/costing';

const history = [
  { validFrom: '2026-01-01', price: 100 },
  { validFrom: '2026-03-15', price: 110 },
  { validFrom: '2026-07-01', price: 95 },
];

describe('priceOn: the price in force on a date', () => {
  it('is null before the first price, then the last price on or before the day', () => {
    expect(priceOn(history, '2025-12-31')).toBeNull();
    expect(priceOn(history, '2026-01-01')?.price).toBe(100);
    expect(priceOn(history, '2026-03-14')?.price).toBe(100);
    expect(priceOn(history, '2026-03-15')?.price).toBe(110);
    expect(priceOn(history, '2026-06-30')?.price).toBe(110);
    expect(priceOn(history, '2031-01-01')?.price).toBe(95);
    expect(priceOn([], '2026-01-01')).toBeNull();
  });

  it('agrees with a scan on every day of a three-year daily history with gaps', () => {
    const days: { validFrom: string; price: number }[] = [];
    const start = Date.UTC(2024, 0, 1);
    for (let d = 0; d < 1096; d += 1 + (d % 3)) days.push({ validFrom: new Date(start + d * 86_400_000).toISOString().slice(0, 10), price: d });
    const scan = (date: string) => days.filter((p) => p.validFrom <= date).at(-1) ?? null;
    for (let d = -2; d < 1100; d++) {
      const date = new Date(start + d * 86_400_000).toISOString().slice(0, 10);
      expect(priceOn(days, date)).toBe(scan(date));
    }
  });
});

describe('sorting and grouping histories', () => {
  it('sorts by day, keeping input order within a day, and groups by key', () => {
    const points = [
      { id: 'a', validFrom: '2026-05-01', n: 1 },
      { id: 'b', validFrom: '2026-01-01', n: 2 },
      { id: 'a', validFrom: '2026-01-01', n: 3 },
      { id: 'a', validFrom: '2026-01-01', n: 4 },
    ];
    expect(sortHistory(points).map((p) => p.n)).toEqual([2, 3, 4, 1]);
    const byId = historiesBy(points, (p) => p.id);
    expect(byId.get('a')?.map((p) => p.n)).toEqual([3, 4, 1]);
    expect(isSortedHistory(byId.get('a') ?? [])).toBe(true);
    expect(priceOn(byId.get('a') ?? [], '2026-02-01')?.n).toBe(4);
  });
});
