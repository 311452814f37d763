import { describe, it, expect } from 'vitest';
import { diffRevisions } from '@/lib/formulas/diff';
import { CITRIC, FRUIT_10, IDS, LEMON, PECTIN_200, PRACTICAL_ACTION_LINES, SUGAR, line, revision, settings } from './fixtures';

// The revisions start from the Practical Action technical brief "Jams, jellies and marmalade"
// worked batch (10 kg fruit at 10 % solids, 10 kg sugar, 60 g pectin, 55 g citric acid).
// How lines pair up is this feature's own rule (by ingredient, in order, k-th occurrence with
// k-th occurrence): Common practice, no published source.

describe('diffRevisions', () => {
  it('finds nothing between a revision and an identical copy', () => {
    const before = revision(1, PRACTICAL_ACTION_LINES);
    const after = revision(2, PRACTICAL_ACTION_LINES.map((l) => ({ ...l, ingredient: { ...l.ingredient } })));
    const diff = diffRevisions(before, after);
    expect(diff.identical).toBe(true);
    expect(diff.name).toBeNull();
    expect(diff.settings).toEqual([]);
    expect(diff.lines.map((l) => l.status)).toEqual(['unchanged', 'unchanged', 'unchanged', 'unchanged']);
    expect(diff.lines.every((l) => l.changes.length === 0)).toBe(true);
    expect(diff.beforeRevision).toBe(1);
    expect(diff.afterRevision).toBe(2);
  });

  it('treats an absent optional setting and a null one as the same, and ignores float noise', () => {
    const before = revision(1, [line(IDS.sugar, SUGAR, 0.3)], { settings: settings({ plannedPh: null }) });
    const after = revision(2, [line(IDS.sugar, SUGAR, 0.1 + 0.2)], { settings: settings() });
    const diff = diffRevisions(before, after);
    expect(diff.settings).toEqual([]);
    expect(diff.lines[0].status).toBe('unchanged');
    expect(diff.identical).toBe(true);
  });

  it('marks added, removed, changed and unchanged lines', () => {
    const before = revision(1, PRACTICAL_ACTION_LINES);
    const after = revision(2, [
      line(IDS.fruit, FRUIT_10, 10_000),
      line(IDS.sugar, SUGAR, 9_500),
      line(IDS.citric, CITRIC, 55),
      line(IDS.lemon, LEMON, 200),
    ]);
    const diff = diffRevisions(before, after);
    expect(diff.identical).toBe(false);
    expect(diff.lines.map((l) => [l.ingredientName, l.status])).toEqual([
      ['Orchard fruit pulp', 'unchanged'],
      ['White sugar', 'changed'],
      // The pectin line sat after the sugar in revision 1, so it is shown there.
      ['HM pectin grade 200', 'removed'],
      ['Citric acid', 'unchanged'],
      ['Lemon juice', 'added'],
    ]);
    const sugar = diff.lines[1];
    expect(sugar.changes).toEqual(['quantity']);
    expect(sugar.before).toEqual({ quantity: 10_000, unit: 'g', solidsPct: 100 });
    expect(sugar.after).toEqual({ quantity: 9_500, unit: 'g', solidsPct: 100 });
    const pectin = diff.lines[2];
    expect(pectin.before).toEqual({ quantity: 60, unit: 'g', solidsPct: 100 });
    expect(pectin.after).toBeUndefined();
    const lemon = diff.lines[4];
    expect(lemon.before).toBeUndefined();
    expect(lemon.after).toEqual({ quantity: 200, unit: 'g', solidsPct: 4.5 });
  });

  it('puts a removed first line at the top', () => {
    const before = revision(1, PRACTICAL_ACTION_LINES);
    const after = revision(2, PRACTICAL_ACTION_LINES.slice(1));
    const diff = diffRevisions(before, after);
    expect(diff.lines[0]).toMatchObject({ status: 'removed', ingredientId: IDS.fruit });
    expect(diff.lines.slice(1).every((l) => l.status === 'unchanged')).toBe(true);
  });

  it('notices a change of unit even when the number stays', () => {
    const before = revision(1, [line(IDS.fruit, FRUIT_10, 1000), line(IDS.pectin, PECTIN_200, 1, 'g')]);
    const after = revision(2, [line(IDS.fruit, FRUIT_10, 1000), line(IDS.pectin, PECTIN_200, 1, 'pct_fruit')]);
    const diff = diffRevisions(before, after);
    expect(diff.lines[1].status).toBe('changed');
    expect(diff.lines[1].changes).toEqual(['unit']);
  });

  it('pairs a repeated ingredient by occurrence', () => {
    const before = revision(1, [line(IDS.fruit, FRUIT_10, 10_000), line(IDS.sugar, SUGAR, 5_000), line(IDS.sugar, SUGAR, 5_000)]);
    const changedSecond = revision(2, [line(IDS.fruit, FRUIT_10, 10_000), line(IDS.sugar, SUGAR, 5_000), line(IDS.sugar, SUGAR, 6_000)]);
    let diff = diffRevisions(before, changedSecond);
    expect(diff.lines.map((l) => l.status)).toEqual(['unchanged', 'unchanged', 'changed']);
    expect(diff.lines[2].before?.quantity).toBe(5_000);
    expect(diff.lines[2].after?.quantity).toBe(6_000);

    const droppedOne = revision(2, [line(IDS.fruit, FRUIT_10, 10_000), line(IDS.sugar, SUGAR, 5_000)]);
    diff = diffRevisions(before, droppedOne);
    expect(diff.lines.map((l) => l.status)).toEqual(['unchanged', 'unchanged', 'removed']);

    const addedThird = revision(2, [...before.lines, line(IDS.sugar, SUGAR, 500)]);
    diff = diffRevisions(before, addedThird);
    expect(diff.lines.map((l) => l.status)).toEqual(['unchanged', 'unchanged', 'unchanged', 'added']);
  });

  it('detects a composition change of the same ingredient between revisions', () => {
    const before = revision(1, PRACTICAL_ACTION_LINES);
    const after = revision(2, [line(IDS.fruit, { ...FRUIT_10, solidsPct: 11, phMax: 3.6 }, 10_000), ...PRACTICAL_ACTION_LINES.slice(1)]);
    const diff = diffRevisions(before, after);
    const fruit = diff.lines[0];
    expect(fruit.status).toBe('changed');
    expect(fruit.changes).toEqual(['ingredient.solidsPct', 'ingredient.phMax']);
    expect(fruit.before?.solidsPct).toBe(10);
    expect(fruit.after?.solidsPct).toBe(11);
    expect(fruit.compositionChanges).toEqual([
      { field: 'solidsPct', label: 'Soluble solids (%)', before: 10, after: 11 },
      { field: 'phMax', label: 'pH, upper', before: null, after: 3.6 },
    ]);
    expect(diff.lines.slice(1).every((l) => l.status === 'unchanged')).toBe(true);
  });

  it('lists only the settings that changed, with human labels', () => {
    const before = revision(1, PRACTICAL_ACTION_LINES);
    const after = revision(2, PRACTICAL_ACTION_LINES, {
      name: 'Orchard jam, less sugar',
      settings: settings({ targetSolidsPct: 65, ruleSet: 'us', altitudeM: 1000 }),
    });
    const diff = diffRevisions(before, after);
    expect(diff.name).toEqual({ before: 'Orchard jam trial', after: 'Orchard jam, less sugar' });
    expect(diff.settings).toEqual([
      { field: 'ruleSet', label: 'Market rule set', before: 'eu', after: 'us' },
      { field: 'targetSolidsPct', label: 'Target soluble solids (%)', before: 68, after: 65 },
      { field: 'altitudeM', label: 'Altitude (m)', before: null, after: 1000 },
    ]);
    expect(diff.lines.every((l) => l.status === 'unchanged')).toBe(true);
    expect(diff.identical).toBe(false);
  });
});
