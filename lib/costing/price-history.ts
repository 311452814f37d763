/**
 * Dated price histories. A price holds from its `validFrom` day until the next point's day, so the
 * price on a date is the last point whose day is on or before it. Histories are sorted once, when
 * they are loaded, and then searched (binary search): a formula costed against three years of daily
 * prices looks at about 11 points per line, not 1,100.
 */

export interface Dated {
  /** YYYY-MM-DD: ISO days compare as strings in calendar order. */
  validFrom: string;
}

/** A copy sorted by day; of two points on the same day the later one in the input wins a lookup. */
export function sortHistory<T extends Dated>(points: readonly T[]): T[] {
  return points
    .map((point, order) => ({ point, order }))
    .sort((a, b) => (a.point.validFrom < b.point.validFrom ? -1 : a.point.validFrom > b.point.validFrom ? 1 : a.order - b.order))
    .map((entry) => entry.point);
}

/** True when the history is in day order (the lookup's precondition). */
export function isSortedHistory(points: readonly Dated[]): boolean {
  for (let i = 1; i < points.length; i++) if (points[i - 1].validFrom > points[i].validFrom) return false;
  return true;
}

/** The point in force on `date` (YYYY-MM-DD) in a history sorted by day, or null before the first. */
export function priceOn<T extends Dated>(sorted: readonly T[], date: string): T | null {
  let low = 0;
  let high = sorted.length; // first index whose day is after `date`
  while (low < high) {
    const mid = (low + high) >>> 1;
    if (sorted[mid].validFrom <= date) low = mid + 1;
    else high = mid;
  }
  return low === 0 ? null : sorted[low - 1];
}

/** Groups points by a key and sorts each group by day: the shape costFormula looks prices up in. */
export function historiesBy<T extends Dated>(points: readonly T[], keyOf: (point: T) => string): Map<string, T[]> {
  const groups = new Map<string, T[]>();
  for (const point of points) {
    const key = keyOf(point);
    const group = groups.get(key);
    if (group) group.push(point);
    else groups.set(key, [point]);
  }
  for (const [key, group] of groups) if (!isSortedHistory(group)) groups.set(key, sortHistory(group));
  return groups;
}
