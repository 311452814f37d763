/**
 * The entities and the migrations describe one schema. On a database the migrations built, MikroORM's
 * generator proposes nothing, so `npm run orm -- migration:create` writes only the change a
 * contributor made (DEVELOPERS.md, "Adding a feature"). Checks, partial and expression indexes written
 * by hand in a migration are declared on their entity for this reason.
 */
import { describe, it, expect } from 'vitest';
import { getOrm } from '@/lib/db';

describe('entities and migrations', () => {
  it('on the migrated test database the schema generator proposes no change', async () => {
    const orm = await getOrm();
    const proposed = await orm.schema.getUpdateSchemaSQL({ wrap: false });
    expect(proposed.trim()).toBe('');
  });
});
