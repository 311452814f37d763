import { Migration } from '@mikro-orm/migrations';

export class Migration20261202021910 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "sensory_attributes" ("id" uuid not null, "workspace_id" uuid not null, "library_key" varchar(60) null, "name" varchar(80) not null, "instruction" text not null, "modality" varchar(30) not null, "scale" jsonb not null, "formulation_caution" text null, "created_at" timestamptz not null, constraint "sensory_attributes_pkey" primary key ("id"));`);

    this.addSql(`create table "panel_sessions" ("id" uuid not null, "workspace_id" uuid not null, "trial_id" uuid not null, "title" varchar(120) not null, "place" varchar(120) null, "starts_at" timestamptz null, "method" text check ("method" in ('rated', 'ranking', 'triangle')) not null, "state" text check ("state" in ('draft', 'open', 'closed')) not null default 'draft', "notice" text not null, "attribute_ids" jsonb not null, "ranking_attribute_id" uuid null, "design" jsonb not null, "join_code" varchar(8) null, "created_by_id" uuid not null, "created_at" timestamptz not null, "opened_at" timestamptz null, "closed_at" timestamptz null, constraint "panel_sessions_pkey" primary key ("id"));`);
    this.addSql(`alter table "panel_sessions" add constraint "panel_sessions_join_code_unique" unique ("join_code");`);
    this.addSql(`create index "panel_sessions_workspace_id_state_index" on "panel_sessions" ("workspace_id", "state");`);

    this.addSql(`create table "panel_seats" ("id" uuid not null, "workspace_id" uuid not null, "session_id" uuid not null, "seat_index" int not null, "kind" text check ("kind" in ('staff', 'guest')) not null, "user_id" uuid null, "display_name" varchar(60) not null, "token_hash" varchar(64) not null, "serving_order" jsonb not null, "design_row" varchar(40) not null, "consented_at" timestamptz null, "submitted_at" timestamptz null, "last_seen_at" timestamptz null, "created_at" timestamptz not null, constraint "panel_seats_pkey" primary key ("id"));`);
    this.addSql(`alter table "panel_seats" add constraint "panel_seats_token_hash_unique" unique ("token_hash");`);
    this.addSql(`alter table "panel_seats" add constraint "panel_seats_session_id_seat_index_unique" unique ("session_id", "seat_index");`);

    this.addSql(`create table "panel_samples" ("id" uuid not null, "workspace_id" uuid not null, "session_id" uuid not null, "variant_id" uuid not null, "code" varchar(3) null, "position" int not null, constraint "panel_samples_pkey" primary key ("id"));`);
    this.addSql(`alter table "panel_samples" add constraint "panel_samples_session_id_variant_id_unique" unique ("session_id", "variant_id");`);
    this.addSql(`alter table "panel_samples" add constraint "panel_samples_session_id_code_unique" unique ("session_id", "code");`);

    this.addSql(`create table "panel_answers" ("id" uuid not null, "workspace_id" uuid not null, "session_id" uuid not null, "seat_id" uuid not null, "kind" text check ("kind" in ('rating', 'ranking', 'triangle')) not null, "item" varchar(3) not null, "attribute" varchar(36) not null, "sample_id" uuid null, "value" double precision null, "ranking" jsonb null, "odd_code" varchar(3) null, "correct" boolean null, "confidence" int null, "comment" text null, "idempotency_key" uuid not null, "created_at" timestamptz not null, "updated_at" timestamptz not null, constraint "panel_answers_pkey" primary key ("id"));`);
    this.addSql(`create index "panel_answers_workspace_id_session_id_index" on "panel_answers" ("workspace_id", "session_id");`);
    this.addSql(`alter table "panel_answers" add constraint "panel_answers_seat_id_item_attribute_unique" unique ("seat_id", "item", "attribute");`);

    this.addSql(`alter table "sensory_attributes" add constraint "sensory_attributes_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);

    this.addSql(`alter table "panel_sessions" add constraint "panel_sessions_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "panel_sessions" add constraint "panel_sessions_trial_id_foreign" foreign key ("trial_id") references "trials" ("id") on update cascade;`);
    this.addSql(`alter table "panel_sessions" add constraint "panel_sessions_created_by_id_foreign" foreign key ("created_by_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "panel_seats" add constraint "panel_seats_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "panel_seats" add constraint "panel_seats_session_id_foreign" foreign key ("session_id") references "panel_sessions" ("id") on update cascade;`);
    this.addSql(`alter table "panel_seats" add constraint "panel_seats_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "panel_samples" add constraint "panel_samples_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "panel_samples" add constraint "panel_samples_session_id_foreign" foreign key ("session_id") references "panel_sessions" ("id") on update cascade;`);
    this.addSql(`alter table "panel_samples" add constraint "panel_samples_variant_id_foreign" foreign key ("variant_id") references "variants" ("id") on update cascade;`);

    this.addSql(`alter table "panel_answers" add constraint "panel_answers_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "panel_answers" add constraint "panel_answers_session_id_foreign" foreign key ("session_id") references "panel_sessions" ("id") on update cascade;`);
    this.addSql(`alter table "panel_answers" add constraint "panel_answers_seat_id_foreign" foreign key ("seat_id") references "panel_seats" ("id") on update cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "panel_seats" drop constraint "panel_seats_session_id_foreign";`);

    this.addSql(`alter table "panel_samples" drop constraint "panel_samples_session_id_foreign";`);

    this.addSql(`alter table "panel_answers" drop constraint "panel_answers_session_id_foreign";`);

    this.addSql(`alter table "panel_answers" drop constraint "panel_answers_seat_id_foreign";`);

    this.addSql(`drop table if exists "sensory_attributes" cascade;`);

    this.addSql(`drop table if exists "panel_sessions" cascade;`);

    this.addSql(`drop table if exists "panel_seats" cascade;`);

    this.addSql(`drop table if exists "panel_samples" cascade;`);

    this.addSql(`drop table if exists "panel_answers" cascade;`);
  }

}
