import { Migration } from '@mikro-orm/migrations';

/**
 * A production version keeps the label computed at approval. Null on versions approved before
 * labels existed: those compute it on read and say it was not frozen. The immutability trigger
 * compares whole rows, so the column is fixed once the version is inserted.
 */
export class Migration20261203145000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "production_formulas" add column "label" jsonb null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "production_formulas" drop column "label";`);
  }

}
