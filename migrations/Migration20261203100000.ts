import { Migration } from '@mikro-orm/migrations';

/** Every idempotency key an answer has had, so a replay of an older one is recognised and never overwrites a newer answer. */
export class Migration20261203100000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "panel_answers" add column "idempotency_keys" uuid[] null;`);
    this.addSql(`update "panel_answers" set "idempotency_keys" = array["idempotency_key"];`);
    this.addSql(`alter table "panel_answers" alter column "idempotency_keys" set not null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "panel_answers" drop column "idempotency_keys";`);
  }

}
