import { Migration } from '@mikro-orm/migrations';

/** A production version's cost on its approval day, frozen with the version (set on insert only). */
export class Migration20261203160000 extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "production_formulas" add column "cost_at_approval" jsonb null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "production_formulas" drop column "cost_at_approval";`);
  }
}
