/**
 * The library list read in one plain statement (listIngredients): filters, sorts, LIKE wildcards
 * taken literally, archived rows, and a view equal to the single read (getIngredient, the ORM).
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { createWorkspace, actorOf, type WorkspaceFixture } from './harness';
import { createIngredient, setIngredientArchived } from '@/lib/ingredients/mutations';
import { getIngredient, listIngredients } from '@/lib/ingredients/queries';

let a: WorkspaceFixture;
let b: WorkspaceFixture;
const names = (list: Array<{ name: string }>) => list.map((i) => i.name);

beforeAll(async () => {
  a = await createWorkspace('List kitchen');
  b = await createWorkspace('Other list kitchen');
  const dev = actorOf(a, 'developer');
  await createIngredient(dev, { name: 'Testsyrup 50% solids', kind: 'sweetener', solidsPct: 50 });
  await createIngredient(dev, { name: 'Testsyrup 505 trial', kind: 'sweetener', solidsPct: 70 });
  await createIngredient(dev, { name: 'Testsyrup_under', kind: 'sweetener', solidsPct: 60 });
  await createIngredient(dev, { name: 'Testsyrup old stock', kind: 'sweetener', solidsPct: 65 });
  const old = (await listIngredients(dev, { q: 'old stock' }))[0];
  await setIngredientArchived(dev, old.id, true);
  await createIngredient(actorOf(b, 'developer'), { name: 'Testsyrup of the other workspace', kind: 'sweetener', solidsPct: 66 });
}, 120_000);

describe('the ingredient list', () => {
  it('takes % and _ in a search literally', async () => {
    const dev = actorOf(a, 'developer');
    expect(names(await listIngredients(dev, { q: '50%' }))).toEqual(['Testsyrup 50% solids']);
    expect(names(await listIngredients(dev, { q: 'p_u' }))).toEqual(['Testsyrup_under']);
  });

  it('filters by kind and by archived, within the workspace only', async () => {
    const dev = actorOf(a, 'developer');
    const current = names(await listIngredients(dev, { kind: 'sweetener', q: 'testsyrup' }));
    expect([...current].sort()).toEqual(['Testsyrup 50% solids', 'Testsyrup 505 trial', 'Testsyrup_under']);
    expect(await listIngredients(dev, { kind: 'fruit', q: 'testsyrup' })).toEqual([]);
    expect(names(await listIngredients(dev, { q: 'testsyrup', archived: 'only' }))).toEqual(['Testsyrup old stock']);
    expect(names(await listIngredients(dev, { q: 'testsyrup', archived: 'include' }))).toHaveLength(4);
    expect(names(await listIngredients(dev, { q: 'other workspace' }))).toEqual([]);
  });

  it('sorts by the column asked, ties by name', async () => {
    const dev = actorOf(a, 'developer');
    expect(names(await listIngredients(dev, { q: 'testsyrup', sort: 'solidsPct', dir: 'desc' }))).toEqual(['Testsyrup 505 trial', 'Testsyrup_under', 'Testsyrup 50% solids']);
    expect(names(await listIngredients(dev, { q: 'testsyrup', sort: 'solidsPct' }))).toEqual(['Testsyrup 50% solids', 'Testsyrup_under', 'Testsyrup 505 trial']);
    // By name in the database's collation, whatever it makes of spaces and underscores: descending is ascending reversed.
    const byName = names(await listIngredients(dev, { q: 'testsyrup' }));
    expect(names(await listIngredients(dev, { q: 'testsyrup', sort: 'name', dir: 'desc' }))).toEqual([...byName].reverse());
  });

  it('gives every row the same view as the single read, starter library included', async () => {
    const dev = actorOf(a, 'developer');
    const list = await listIngredients(dev, { archived: 'include' });
    expect(list.length).toBeGreaterThan(20);
    for (const row of list) expect(row).toEqual(await getIngredient(dev, row.id));
  });
});
