import { Migration } from '@mikro-orm/migrations';

/**
 * Prices and packaging (lib/pricing): the workspace's currency and cost settings, dated price
 * points for ingredients and packaging items (kept for ever: a trigger refuses deletes and every
 * update but the one-time withdrawal), pack formats with their packaging, the refuse/trim share of
 * an ingredient, and the pack format a formula or a production version is costed in.
 */
export class Migration20261203150000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "cost_settings" ("id" uuid not null, "workspace_id" uuid not null, "currency" varchar(3) not null, "overfill_pct" double precision not null default 0, "cost_warning_pct" double precision not null default 5, "updated_by_id" uuid not null, "updated_at" timestamptz not null, constraint "cost_settings_pkey" primary key ("id"));`);
    this.addSql(`alter table "cost_settings" add constraint "cost_settings_workspace_id_unique" unique ("workspace_id");`);
    this.addSql(`alter table "cost_settings" add constraint "cost_settings_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "cost_settings" add constraint "cost_settings_updated_by_id_foreign" foreign key ("updated_by_id") references "users" ("id") on update cascade;`);

    this.addSql(`create table "ingredient_prices" ("id" uuid not null, "workspace_id" uuid not null, "ingredient_id" uuid not null, "valid_from" date not null, "pack_price_minor" int not null, "pack_size_g" double precision not null, "supplier" varchar(120) null, "entered_by_id" uuid not null, "entered_at" timestamptz not null, "withdrawn_at" timestamptz null, "withdrawn_by_id" uuid null, "withdraw_reason" text null, constraint "ingredient_prices_pkey" primary key ("id"), constraint "ingredient_prices_amounts_check" check ("pack_price_minor" >= 0 and "pack_size_g" > 0));`);
    this.addSql(`alter table "ingredient_prices" add constraint "ingredient_prices_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "ingredient_prices" add constraint "ingredient_prices_ingredient_id_foreign" foreign key ("ingredient_id") references "ingredients" ("id") on update cascade;`);
    this.addSql(`alter table "ingredient_prices" add constraint "ingredient_prices_entered_by_id_foreign" foreign key ("entered_by_id") references "users" ("id") on update cascade;`);
    this.addSql(`alter table "ingredient_prices" add constraint "ingredient_prices_withdrawn_by_id_foreign" foreign key ("withdrawn_by_id") references "users" ("id") on update cascade on delete set null;`);
    // "The latest point on or before a day" per ingredient: an index-ordered scan, newest first.
    this.addSql(`create index "ingredient_prices_as_of_index" on "ingredient_prices" ("workspace_id", "ingredient_id", "valid_from" desc, "entered_at" desc) where "withdrawn_at" is null;`);
    this.addSql(`create index "ingredient_prices_history_index" on "ingredient_prices" ("workspace_id", "ingredient_id", "valid_from");`);

    this.addSql(`create table "packaging_items" ("id" uuid not null, "workspace_id" uuid not null, "name" varchar(120) not null, "kind" text check ("kind" in ('jar', 'lid', 'label', 'case', 'other')) not null, "archived_at" timestamptz null, "created_at" timestamptz not null, constraint "packaging_items_pkey" primary key ("id"));`);
    this.addSql(`create index "packaging_items_workspace_id_name_index" on "packaging_items" ("workspace_id", "name");`);
    this.addSql(`alter table "packaging_items" add constraint "packaging_items_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);

    this.addSql(`create table "packaging_prices" ("id" uuid not null, "workspace_id" uuid not null, "packaging_item_id" uuid not null, "valid_from" date not null, "pack_price_minor" int not null, "pieces_per_pack" int not null, "supplier" varchar(120) null, "entered_by_id" uuid not null, "entered_at" timestamptz not null, "withdrawn_at" timestamptz null, "withdrawn_by_id" uuid null, "withdraw_reason" text null, constraint "packaging_prices_pkey" primary key ("id"), constraint "packaging_prices_amounts_check" check ("pack_price_minor" >= 0 and "pieces_per_pack" > 0));`);
    this.addSql(`alter table "packaging_prices" add constraint "packaging_prices_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "packaging_prices" add constraint "packaging_prices_packaging_item_id_foreign" foreign key ("packaging_item_id") references "packaging_items" ("id") on update cascade;`);
    this.addSql(`alter table "packaging_prices" add constraint "packaging_prices_entered_by_id_foreign" foreign key ("entered_by_id") references "users" ("id") on update cascade;`);
    this.addSql(`alter table "packaging_prices" add constraint "packaging_prices_withdrawn_by_id_foreign" foreign key ("withdrawn_by_id") references "users" ("id") on update cascade on delete set null;`);
    this.addSql(`create index "packaging_prices_as_of_index" on "packaging_prices" ("workspace_id", "packaging_item_id", "valid_from" desc, "entered_at" desc) where "withdrawn_at" is null;`);
    this.addSql(`create index "packaging_prices_history_index" on "packaging_prices" ("workspace_id", "packaging_item_id", "valid_from");`);

    // A price point is kept as entered: the only change is its one-time withdrawal.
    this.addSql(`create function price_points_guard() returns trigger language plpgsql as $$
begin
  if tg_op = 'DELETE' then raise exception '% points are never deleted', tg_table_name using errcode = 'P0001'; end if;
  if old.withdrawn_at is null and new.withdrawn_at is not null and new.withdrawn_by_id is not null and new.withdraw_reason is not null
     and (to_jsonb(new) - 'withdrawn_at' - 'withdrawn_by_id' - 'withdraw_reason') = (to_jsonb(old) - 'withdrawn_at' - 'withdrawn_by_id' - 'withdraw_reason') then
    return new;
  end if;
  raise exception '% points are never changed', tg_table_name using errcode = 'P0001';
end $$;`);
    this.addSql(`create trigger ingredient_prices_kept before update or delete on "ingredient_prices" for each row execute function price_points_guard();`);
    this.addSql(`create trigger packaging_prices_kept before update or delete on "packaging_prices" for each row execute function price_points_guard();`);

    this.addSql(`create table "pack_formats" ("id" uuid not null, "workspace_id" uuid not null, "name" varchar(120) not null, "net_fill_g" double precision not null, "archived_at" timestamptz null, "created_at" timestamptz not null, constraint "pack_formats_pkey" primary key ("id"), constraint "pack_formats_net_fill_check" check ("net_fill_g" > 0));`);
    this.addSql(`create index "pack_formats_workspace_id_name_index" on "pack_formats" ("workspace_id", "name");`);
    this.addSql(`alter table "pack_formats" add constraint "pack_formats_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);

    this.addSql(`create table "pack_format_items" ("id" uuid not null, "workspace_id" uuid not null, "pack_format_id" uuid not null, "packaging_item_id" uuid not null, "pieces" int not null, "per_jars" int not null, "position" int not null, constraint "pack_format_items_pkey" primary key ("id"), constraint "pack_format_items_share_check" check ("pieces" > 0 and "per_jars" > 0));`);
    this.addSql(`alter table "pack_format_items" add constraint "pack_format_items_pack_format_id_packaging_item_id_unique" unique ("pack_format_id", "packaging_item_id");`);
    this.addSql(`alter table "pack_format_items" add constraint "pack_format_items_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "pack_format_items" add constraint "pack_format_items_pack_format_id_foreign" foreign key ("pack_format_id") references "pack_formats" ("id") on update cascade;`);
    this.addSql(`alter table "pack_format_items" add constraint "pack_format_items_packaging_item_id_foreign" foreign key ("packaging_item_id") references "packaging_items" ("id") on update cascade;`);

    this.addSql(`alter table "ingredients" add column "refuse_pct" double precision not null default 0;`);
    this.addSql(`alter table "ingredients" add constraint "ingredients_refuse_pct_check" check ("refuse_pct" >= 0 and "refuse_pct" <= 95);`);

    this.addSql(`alter table "formulas" add column "pack_format_id" uuid null;`);
    this.addSql(`alter table "formulas" add constraint "formulas_pack_format_id_foreign" foreign key ("pack_format_id") references "pack_formats" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "production_formulas" add column "pack_format_id" uuid null;`);
    this.addSql(`alter table "production_formulas" add constraint "production_formulas_pack_format_id_foreign" foreign key ("pack_format_id") references "pack_formats" ("id") on update cascade on delete set null;`);
    // A version stays frozen; which jar it is filled in may be chosen later (packaging is not the recipe).
    this.addSql(`create or replace function production_formulas_guard() returns trigger language plpgsql as $$
begin
  if tg_op = 'DELETE' then raise exception 'production versions cannot be deleted' using errcode = 'P0001'; end if;
  if old.status = 'current' and new.status = 'superseded' and new.superseded_at is not null and new.superseded_by_version is not null
     and (to_jsonb(new) - 'status' - 'superseded_at' - 'superseded_by_version') = (to_jsonb(old) - 'status' - 'superseded_at' - 'superseded_by_version') then
    return new;
  end if;
  if (to_jsonb(new) - 'pack_format_id') = (to_jsonb(old) - 'pack_format_id') then
    return new;
  end if;
  raise exception 'production versions are immutable' using errcode = 'P0001';
end $$;`);
  }

  override async down(): Promise<void> {
    this.addSql(`create or replace function production_formulas_guard() returns trigger language plpgsql as $$
begin
  if tg_op = 'DELETE' then raise exception 'production versions cannot be deleted' using errcode = 'P0001'; end if;
  if old.status = 'current' and new.status = 'superseded' and new.superseded_at is not null and new.superseded_by_version is not null
     and (to_jsonb(new) - 'status' - 'superseded_at' - 'superseded_by_version') = (to_jsonb(old) - 'status' - 'superseded_at' - 'superseded_by_version') then
    return new;
  end if;
  raise exception 'production versions are immutable' using errcode = 'P0001';
end $$;`);
    this.addSql(`alter table "production_formulas" drop constraint "production_formulas_pack_format_id_foreign";`);
    this.addSql(`alter table "production_formulas" drop column "pack_format_id";`);
    this.addSql(`alter table "formulas" drop constraint "formulas_pack_format_id_foreign";`);
    this.addSql(`alter table "formulas" drop column "pack_format_id";`);
    this.addSql(`alter table "ingredients" drop constraint "ingredients_refuse_pct_check";`);
    this.addSql(`alter table "ingredients" drop column "refuse_pct";`);
    this.addSql(`drop table if exists "pack_format_items" cascade;`);
    this.addSql(`drop table if exists "pack_formats" cascade;`);
    this.addSql(`drop table if exists "packaging_prices" cascade;`);
    this.addSql(`drop table if exists "ingredient_prices" cascade;`);
    this.addSql(`drop function if exists price_points_guard();`);
    this.addSql(`drop table if exists "packaging_items" cascade;`);
    this.addSql(`drop table if exists "cost_settings" cascade;`);
  }

}
