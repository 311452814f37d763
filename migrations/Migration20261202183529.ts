import { Migration } from '@mikro-orm/migrations';

export class Migration20261202183529 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "products" ("id" uuid not null, "workspace_id" uuid not null, "code" varchar(5) not null, "name" varchar(120) not null, "created_by_id" uuid not null, "created_at" timestamptz not null, constraint "products_pkey" primary key ("id"));`);
    this.addSql(`alter table "products" add constraint "products_workspace_id_code_unique" unique ("workspace_id", "code");`);

    this.addSql(`create table "promotion_requests" ("id" uuid not null, "workspace_id" uuid not null, "number" int not null, "trial_id" uuid not null, "variant_id" uuid not null, "variant_label" varchar(8) not null, "product_id" uuid null, "new_product_name" varchar(120) null, "new_product_code" varchar(5) null, "rationale" text not null, "process" jsonb not null, "spec" jsonb not null, "evidence" jsonb not null, "status" text check ("status" in ('pending', 'approved', 'sent_back', 'withdrawn')) not null default 'pending', "requested_by_id" uuid not null, "requested_at" timestamptz not null, "decided_by_id" uuid null, "decided_at" timestamptz null, "decision_comment" text null, "production_formula_id" uuid null, constraint "promotion_requests_pkey" primary key ("id"));`);
    this.addSql(`create index "promotion_requests_workspace_id_status_index" on "promotion_requests" ("workspace_id", "status");`);
    this.addSql(`alter table "promotion_requests" add constraint "promotion_requests_workspace_id_number_unique" unique ("workspace_id", "number");`);

    this.addSql(`create table "production_formulas" ("id" uuid not null, "workspace_id" uuid not null, "product_id" uuid not null, "version" int not null, "status" text check ("status" in ('current', 'superseded')) not null default 'current', "settings" jsonb not null, "lines" jsonb not null, "process" jsonb not null, "compliance" jsonb not null, "spec" jsonb not null, "source_trial_id" uuid not null, "source_variant_id" uuid not null, "source_variant_label" varchar(8) not null, "promotion_request_id" uuid not null, "approved_by_id" uuid not null, "approved_at" timestamptz not null, "superseded_at" timestamptz null, "superseded_by_version" int null, constraint "production_formulas_pkey" primary key ("id"));`);
    this.addSql(`create index "production_formulas_workspace_id_status_index" on "production_formulas" ("workspace_id", "status");`);
    this.addSql(`alter table "production_formulas" add constraint "production_formulas_product_id_version_unique" unique ("product_id", "version");`);

    this.addSql(`create table "batch_records" ("id" uuid not null, "workspace_id" uuid not null, "product_id" uuid not null, "production_formula_id" uuid not null, "lot_code" varchar(16) not null, "batch_date" date not null, "batch_size_g" double precision not null, "brix_reading" double precision not null, "brix_sample_temp_c" double precision not null, "brix20" double precision not null, "ph" double precision not null, "fill_temp_c" double precision not null, "net_fill_mean_g" double precision null, "net_fill_min_g" double precision null, "set_test_score" int null, "jars_filled" int not null, "jars_rejected" int not null, "notes" text null, "checks" jsonb not null, "outcome" text check ("outcome" in ('pass', 'fail')) not null, "disposition" text check ("disposition" in ('rework', 'hold', 'discard')) null, "disposition_comment" text null, "recorded_by_id" uuid not null, "created_at" timestamptz not null, constraint "batch_records_pkey" primary key ("id"));`);
    this.addSql(`create index "batch_records_workspace_id_product_id_batch_date_index" on "batch_records" ("workspace_id", "product_id", "batch_date");`);
    this.addSql(`alter table "batch_records" add constraint "batch_records_workspace_id_lot_code_unique" unique ("workspace_id", "lot_code");`);

    this.addSql(`create table "audit_events" ("id" uuid not null, "workspace_id" uuid not null, "at" timestamptz not null, "actor_id" uuid not null, "actor_name" varchar(120) not null, "actor_role" varchar(20) not null, "action" varchar(40) not null, "subject_type" varchar(40) not null, "subject_id" uuid not null, "promotion_request_id" uuid null, "summary" text not null, constraint "audit_events_pkey" primary key ("id"));`);
    this.addSql(`create index "audit_events_workspace_id_at_index" on "audit_events" ("workspace_id", "at");`);
    this.addSql(`create index "audit_events_workspace_id_subject_id_index" on "audit_events" ("workspace_id", "subject_id");`);

    this.addSql(`alter table "products" add constraint "products_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "products" add constraint "products_created_by_id_foreign" foreign key ("created_by_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "promotion_requests" add constraint "promotion_requests_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "promotion_requests" add constraint "promotion_requests_trial_id_foreign" foreign key ("trial_id") references "trials" ("id") on update cascade;`);
    this.addSql(`alter table "promotion_requests" add constraint "promotion_requests_product_id_foreign" foreign key ("product_id") references "products" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "promotion_requests" add constraint "promotion_requests_requested_by_id_foreign" foreign key ("requested_by_id") references "users" ("id") on update cascade;`);
    this.addSql(`alter table "promotion_requests" add constraint "promotion_requests_decided_by_id_foreign" foreign key ("decided_by_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "production_formulas" add constraint "production_formulas_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "production_formulas" add constraint "production_formulas_product_id_foreign" foreign key ("product_id") references "products" ("id") on update cascade;`);
    this.addSql(`alter table "production_formulas" add constraint "production_formulas_source_trial_id_foreign" foreign key ("source_trial_id") references "trials" ("id") on update cascade;`);
    this.addSql(`alter table "production_formulas" add constraint "production_formulas_approved_by_id_foreign" foreign key ("approved_by_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "batch_records" add constraint "batch_records_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "batch_records" add constraint "batch_records_product_id_foreign" foreign key ("product_id") references "products" ("id") on update cascade;`);
    this.addSql(`alter table "batch_records" add constraint "batch_records_production_formula_id_foreign" foreign key ("production_formula_id") references "production_formulas" ("id") on update cascade;`);
    this.addSql(`alter table "batch_records" add constraint "batch_records_recorded_by_id_foreign" foreign key ("recorded_by_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "audit_events" add constraint "audit_events_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "audit_events" add constraint "audit_events_actor_id_foreign" foreign key ("actor_id") references "users" ("id") on update cascade;`);

    // One version in production per product, one open request per trial.
    this.addSql(`create unique index "production_formulas_one_current" on "production_formulas" ("product_id") where "status" = 'current';`);
    this.addSql(`create unique index "promotion_requests_one_pending" on "promotion_requests" ("trial_id") where "status" = 'pending';`);

    // A production version never changes, except the one-way move from current to superseded.
    this.addSql(`create function production_formulas_guard() returns trigger language plpgsql as $$
begin
  if tg_op = 'DELETE' then raise exception 'production versions cannot be deleted' using errcode = 'P0001'; end if;
  if old.status = 'current' and new.status = 'superseded' and new.superseded_at is not null and new.superseded_by_version is not null
     and (to_jsonb(new) - 'status' - 'superseded_at' - 'superseded_by_version') = (to_jsonb(old) - 'status' - 'superseded_at' - 'superseded_by_version') then
    return new;
  end if;
  raise exception 'production versions are immutable' using errcode = 'P0001';
end $$;`);
    this.addSql(`create trigger production_formulas_no_change before update or delete on "production_formulas" for each row execute function production_formulas_guard();`);

    // A request is decided once; what was asked and the evidence never change.
    this.addSql(`create function promotion_requests_guard() returns trigger language plpgsql as $$
begin
  if tg_op = 'DELETE' then raise exception 'promotion requests cannot be deleted' using errcode = 'P0001'; end if;
  if old.status <> 'pending' then raise exception 'a decided promotion request cannot change' using errcode = 'P0001'; end if;
  if (to_jsonb(new) - 'status' - 'decided_by_id' - 'decided_at' - 'decision_comment' - 'production_formula_id' - 'product_id')
     <> (to_jsonb(old) - 'status' - 'decided_by_id' - 'decided_at' - 'decision_comment' - 'production_formula_id' - 'product_id') then
    raise exception 'a promotion request''s content cannot change' using errcode = 'P0001';
  end if;
  return new;
end $$;`);
    this.addSql(`create trigger promotion_requests_no_change before update or delete on "promotion_requests" for each row execute function promotion_requests_guard();`);

    // Batch records and the audit trail are insert-only.
    this.addSql(`create function insert_only_guard() returns trigger language plpgsql as $$ begin raise exception '% is insert-only', tg_table_name using errcode = 'P0001'; end $$;`);
    this.addSql(`create trigger batch_records_insert_only before update or delete on "batch_records" for each row execute function insert_only_guard();`);
    this.addSql(`create trigger audit_events_insert_only before update or delete on "audit_events" for each row execute function insert_only_guard();`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop trigger if exists audit_events_insert_only on "audit_events";`);
    this.addSql(`drop trigger if exists batch_records_insert_only on "batch_records";`);
    this.addSql(`drop trigger if exists promotion_requests_no_change on "promotion_requests";`);
    this.addSql(`drop trigger if exists production_formulas_no_change on "production_formulas";`);
    this.addSql(`drop function if exists insert_only_guard();`);
    this.addSql(`drop function if exists promotion_requests_guard();`);
    this.addSql(`drop function if exists production_formulas_guard();`);
    this.addSql(`alter table "promotion_requests" drop constraint "promotion_requests_product_id_foreign";`);

    this.addSql(`alter table "production_formulas" drop constraint "production_formulas_product_id_foreign";`);

    this.addSql(`alter table "batch_records" drop constraint "batch_records_product_id_foreign";`);

    this.addSql(`alter table "batch_records" drop constraint "batch_records_production_formula_id_foreign";`);

    this.addSql(`drop table if exists "products" cascade;`);

    this.addSql(`drop table if exists "promotion_requests" cascade;`);

    this.addSql(`drop table if exists "production_formulas" cascade;`);

    this.addSql(`drop table if exists "batch_records" cascade;`);

    this.addSql(`drop table if exists "audit_events" cascade;`);
  }

}
