import { Migration } from '@mikro-orm/migrations';

export class Migration20261202012151 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "ingredients" ("id" uuid not null, "workspace_id" uuid not null, "name" varchar(120) not null, "kind" text check ("kind" in ('fruit', 'sweetener', 'pectin', 'acid', 'water', 'other')) not null, "solids_pct" double precision not null, "ph_min" double precision null, "ph_max" double precision null, "acid_pct" double precision null, "pectin_level" text check ("pectin_level" in ('high', 'medium', 'low')) null, "eu_fruit_group" text check ("eu_fruit_group" in ('general', 'reduced_minimum_fruits', 'ginger', 'cashew_apple', 'passion_fruit', 'citrus')) null, "us_fruit_group" text check ("us_fruit_group" in ('1', '2')) null, "pectin_type" text check ("pectin_type" in ('hm_rapid_set', 'hm_slow_set', 'lm_conventional', 'lm_amidated')) null, "pectin_grade" double precision null, "sweetener_type" text check ("sweetener_type" in ('sucrose', 'glucose_syrup', 'invert_sugar', 'honey', 'fructose', 'dextrose', 'other')) null, "acid_type" text check ("acid_type" in ('citric', 'malic', 'tartaric', 'lemon_juice', 'other')) null, "calcium_source" boolean not null default false, "notes" text null, "origin" text check ("origin" in ('typical', 'edited', 'custom')) not null, "typical_key" varchar(60) null, "source" text null, "archived_at" timestamptz null, "updated_by_id" uuid null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "ingredients_pkey" primary key ("id"));`);
    this.addSql(`create index "ingredients_workspace_id_name_index" on "ingredients" ("workspace_id", "name");`);

    this.addSql(`create table "formulas" ("id" uuid not null, "workspace_id" uuid not null, "name" varchar(120) not null, "description" text null, "latest_revision" int not null, "created_by_id" uuid not null, "updated_by_id" uuid not null, "archived_at" timestamptz null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "formulas_pkey" primary key ("id"));`);
    this.addSql(`create index "formulas_workspace_id_updated_at_index" on "formulas" ("workspace_id", "updated_at");`);

    this.addSql(`create table "formula_revisions" ("id" uuid not null, "workspace_id" uuid not null, "formula_id" uuid not null, "number" int not null, "name" varchar(120) not null, "settings" jsonb not null, "lines" jsonb not null, "note" text null, "summary" jsonb not null, "created_by_id" uuid not null, "created_at" timestamptz not null, constraint "formula_revisions_pkey" primary key ("id"));`);
    this.addSql(`alter table "formula_revisions" add constraint "formula_revisions_formula_id_number_unique" unique ("formula_id", "number");`);

    this.addSql(`alter table "ingredients" add constraint "ingredients_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "ingredients" add constraint "ingredients_updated_by_id_foreign" foreign key ("updated_by_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "formulas" add constraint "formulas_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "formulas" add constraint "formulas_created_by_id_foreign" foreign key ("created_by_id") references "users" ("id") on update cascade;`);
    this.addSql(`alter table "formulas" add constraint "formulas_updated_by_id_foreign" foreign key ("updated_by_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "formula_revisions" add constraint "formula_revisions_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "formula_revisions" add constraint "formula_revisions_formula_id_foreign" foreign key ("formula_id") references "formulas" ("id") on update cascade;`);
    this.addSql(`alter table "formula_revisions" add constraint "formula_revisions_created_by_id_foreign" foreign key ("created_by_id") references "users" ("id") on update cascade;`);

    // Revisions are history: the database itself refuses to change or delete one.
    this.addSql(`create function formula_revisions_immutable() returns trigger language plpgsql as $$ begin raise exception 'formula revisions are immutable' using errcode = 'P0001'; end $$;`);
    this.addSql(`create trigger formula_revisions_no_change before update or delete on "formula_revisions" for each row execute function formula_revisions_immutable();`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop trigger if exists formula_revisions_no_change on "formula_revisions";`);
    this.addSql(`drop function if exists formula_revisions_immutable();`);
    this.addSql(`drop table if exists "formula_revisions" cascade;`);
    this.addSql(`drop table if exists "formulas" cascade;`);
    this.addSql(`drop table if exists "ingredients" cascade;`);
  }

}
