import { Migration } from '@mikro-orm/migrations';

export class Migration20261202014218 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "trials" ("id" uuid not null, "workspace_id" uuid not null, "number" int not null, "title" varchar(160) not null, "question" text not null, "owner_id" uuid not null, "base_formula_id" uuid not null, "base_revision" int not null, "status" text check ("status" in ('planning', 'cooking', 'tasting', 'decided', 'archived')) not null default 'planning', "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "trials_pkey" primary key ("id"));`);
    this.addSql(`create index "trials_workspace_id_status_index" on "trials" ("workspace_id", "status");`);
    this.addSql(`alter table "trials" add constraint "trials_workspace_id_number_unique" unique ("workspace_id", "number");`);

    this.addSql(`create table "variants" ("id" uuid not null, "workspace_id" uuid not null, "trial_id" uuid not null, "label" varchar(8) not null, "is_base" boolean not null default false, "description" varchar(200) not null, "factor_levels" jsonb not null, "settings" jsonb not null, "lines" jsonb not null, "summary" jsonb not null, "position" int not null, "created_by_id" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, "removed_at" timestamptz null, constraint "variants_pkey" primary key ("id"));`);
    this.addSql(`alter table "variants" add constraint "variants_trial_id_label_unique" unique ("trial_id", "label");`);

    this.addSql(`create table "measurements" ("id" uuid not null, "workspace_id" uuid not null, "variant_id" uuid not null, "cook_date" date not null, "batch_size_g" double precision null, "brix_reading" double precision null, "brix_sample_temp_c" double precision null, "ph" double precision null, "end_point_temp_c" double precision null, "boil_time_min" double precision null, "set_test_score" int null, "set_test_method" text check ("set_test_method" in ('cold_plate', 'spoon', 'flake')) null, "syneresis" text check ("syneresis" in ('none', 'slight', 'marked')) null, "colour_notes" text null, "yield_jars" int null, "yield_g" double precision null, "notes" text null, "recorded_by_id" uuid not null, "created_at" timestamptz not null, constraint "measurements_pkey" primary key ("id"));`);
    this.addSql(`create index "measurements_workspace_id_variant_id_index" on "measurements" ("workspace_id", "variant_id");`);

    this.addSql(`create table "uploads" ("id" uuid not null, "workspace_id" uuid not null, "trial_id" uuid not null, "variant_id" uuid null, "measurement_id" uuid null, "kind" text check ("kind" in ('photo', 'file')) not null, "subject" varchar(40) null, "original_name" varchar(255) not null, "content_type" varchar(100) not null, "size_bytes" int not null, "storage_key" varchar(300) not null, "thumbnail_key" varchar(300) null, "width" int null, "height" int null, "uploaded_by_id" uuid not null, "created_at" timestamptz not null, constraint "uploads_pkey" primary key ("id"));`);
    this.addSql(`create index "uploads_workspace_id_trial_id_index" on "uploads" ("workspace_id", "trial_id");`);

    this.addSql(`create table "trial_status_changes" ("id" uuid not null, "workspace_id" uuid not null, "trial_id" uuid not null, "from_status" text check ("from_status" in ('planning', 'cooking', 'tasting', 'decided', 'archived')) null, "to_status" text check ("to_status" in ('planning', 'cooking', 'tasting', 'decided', 'archived')) not null, "note" text null, "changed_by_id" uuid not null, "changed_at" timestamptz not null, constraint "trial_status_changes_pkey" primary key ("id"));`);

    this.addSql(`create table "notebook_entries" ("id" uuid not null, "workspace_id" uuid not null, "trial_id" uuid not null, "variant_id" uuid null, "doc" jsonb not null, "version" int not null default 0, "updated_by_id" uuid null, "updated_at" timestamptz not null, constraint "notebook_entries_pkey" primary key ("id"));`);
    // NULLS NOT DISTINCT (PostgreSQL 15+): one trial-level entry (variant_id null) per trial, too.
    this.addSql(`alter table "notebook_entries" add constraint "notebook_entries_trial_id_variant_id_unique" unique nulls not distinct ("trial_id", "variant_id");`);

    this.addSql(`create table "notebook_conflicts" ("id" uuid not null, "workspace_id" uuid not null, "entry_id" uuid not null, "doc" jsonb not null, "base_version" int not null, "saved_by_id" uuid not null, "created_at" timestamptz not null, "resolved_at" timestamptz null, constraint "notebook_conflicts_pkey" primary key ("id"));`);

    this.addSql(`alter table "trials" add constraint "trials_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "trials" add constraint "trials_owner_id_foreign" foreign key ("owner_id") references "users" ("id") on update cascade;`);
    this.addSql(`alter table "trials" add constraint "trials_base_formula_id_foreign" foreign key ("base_formula_id") references "formulas" ("id") on update cascade;`);

    this.addSql(`alter table "variants" add constraint "variants_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "variants" add constraint "variants_trial_id_foreign" foreign key ("trial_id") references "trials" ("id") on update cascade;`);
    this.addSql(`alter table "variants" add constraint "variants_created_by_id_foreign" foreign key ("created_by_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "measurements" add constraint "measurements_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "measurements" add constraint "measurements_variant_id_foreign" foreign key ("variant_id") references "variants" ("id") on update cascade;`);
    this.addSql(`alter table "measurements" add constraint "measurements_recorded_by_id_foreign" foreign key ("recorded_by_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "uploads" add constraint "uploads_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "uploads" add constraint "uploads_trial_id_foreign" foreign key ("trial_id") references "trials" ("id") on update cascade;`);
    this.addSql(`alter table "uploads" add constraint "uploads_uploaded_by_id_foreign" foreign key ("uploaded_by_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "trial_status_changes" add constraint "trial_status_changes_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "trial_status_changes" add constraint "trial_status_changes_trial_id_foreign" foreign key ("trial_id") references "trials" ("id") on update cascade;`);
    this.addSql(`alter table "trial_status_changes" add constraint "trial_status_changes_changed_by_id_foreign" foreign key ("changed_by_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "notebook_entries" add constraint "notebook_entries_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "notebook_entries" add constraint "notebook_entries_trial_id_foreign" foreign key ("trial_id") references "trials" ("id") on update cascade;`);
    this.addSql(`alter table "notebook_entries" add constraint "notebook_entries_updated_by_id_foreign" foreign key ("updated_by_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "notebook_conflicts" add constraint "notebook_conflicts_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "notebook_conflicts" add constraint "notebook_conflicts_entry_id_foreign" foreign key ("entry_id") references "notebook_entries" ("id") on update cascade;`);
    this.addSql(`alter table "notebook_conflicts" add constraint "notebook_conflicts_saved_by_id_foreign" foreign key ("saved_by_id") references "users" ("id") on update cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "variants" drop constraint "variants_trial_id_foreign";`);

    this.addSql(`alter table "uploads" drop constraint "uploads_trial_id_foreign";`);

    this.addSql(`alter table "trial_status_changes" drop constraint "trial_status_changes_trial_id_foreign";`);

    this.addSql(`alter table "notebook_entries" drop constraint "notebook_entries_trial_id_foreign";`);

    this.addSql(`alter table "measurements" drop constraint "measurements_variant_id_foreign";`);

    this.addSql(`alter table "notebook_conflicts" drop constraint "notebook_conflicts_entry_id_foreign";`);

    this.addSql(`drop table if exists "trials" cascade;`);

    this.addSql(`drop table if exists "variants" cascade;`);

    this.addSql(`drop table if exists "measurements" cascade;`);

    this.addSql(`drop table if exists "uploads" cascade;`);

    this.addSql(`drop table if exists "trial_status_changes" cascade;`);

    this.addSql(`drop table if exists "notebook_entries" cascade;`);

    this.addSql(`drop table if exists "notebook_conflicts" cascade;`);
  }

}
