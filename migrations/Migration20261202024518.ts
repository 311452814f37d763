import { Migration } from '@mikro-orm/migrations';

export class Migration20261202024518 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "trials" add column "recommended_variant_id" uuid null, add column "recommendation_rationale" text null, add column "recommended_by_id" uuid null, add column "recommended_at" timestamptz null;`);
    this.addSql(`alter table "trials" add constraint "trials_recommended_by_id_foreign" foreign key ("recommended_by_id") references "users" ("id") on update cascade on delete set null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "trials" drop constraint "trials_recommended_by_id_foreign";`);

    this.addSql(`alter table "trials" drop column "recommended_variant_id", drop column "recommendation_rationale", drop column "recommended_by_id", drop column "recommended_at";`);
  }

}
