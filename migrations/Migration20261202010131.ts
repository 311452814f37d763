import { Migration } from '@mikro-orm/migrations';

export class Migration20261202010131 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "rate_limits" ("key" varchar(255) not null, "points" int not null default 0, "expire" bigint null, constraint "rate_limits_pkey" primary key ("key"));`);

    this.addSql(`create table "users" ("id" uuid not null, "email" varchar(254) not null, "name" varchar(120) not null, "password_hash" varchar(100) null, "mass_units" text check ("mass_units" in ('metric', 'imperial')) not null default 'metric', "temperature_unit" text check ("temperature_unit" in ('C', 'F')) not null default 'C', "created_at" timestamptz not null, constraint "users_pkey" primary key ("id"));`);
    this.addSql(`alter table "users" add constraint "users_email_unique" unique ("email");`);

    this.addSql(`create table "password_resets" ("id" uuid not null, "user_id" uuid not null, "token_hash" varchar(64) not null, "expires_at" timestamptz not null, "used_at" timestamptz null, "created_at" timestamptz not null, constraint "password_resets_pkey" primary key ("id"));`);
    this.addSql(`alter table "password_resets" add constraint "password_resets_token_hash_unique" unique ("token_hash");`);

    this.addSql(`create table "workspaces" ("id" uuid not null, "name" varchar(120) not null, "slug" varchar(60) not null, "created_at" timestamptz not null, constraint "workspaces_pkey" primary key ("id"));`);
    this.addSql(`alter table "workspaces" add constraint "workspaces_slug_unique" unique ("slug");`);

    this.addSql(`create table "memberships" ("id" uuid not null, "workspace_id" uuid not null, "user_id" uuid not null, "role" text check ("role" in ('admin', 'developer', 'head_of_product', 'production', 'taster')) not null, "active" boolean not null default true, "created_at" timestamptz not null, constraint "memberships_pkey" primary key ("id"));`);
    this.addSql(`alter table "memberships" add constraint "memberships_workspace_id_user_id_unique" unique ("workspace_id", "user_id");`);

    this.addSql(`create table "invitations" ("id" uuid not null, "workspace_id" uuid not null, "email" varchar(254) not null, "role" text check ("role" in ('admin', 'developer', 'head_of_product', 'production', 'taster')) not null, "token_hash" varchar(64) not null, "invited_by_id" uuid not null, "expires_at" timestamptz not null, "accepted_at" timestamptz null, "revoked_at" timestamptz null, "created_at" timestamptz not null, constraint "invitations_pkey" primary key ("id"));`);
    this.addSql(`alter table "invitations" add constraint "invitations_token_hash_unique" unique ("token_hash");`);

    this.addSql(`create table "api_tokens" ("id" uuid not null, "workspace_id" uuid not null, "user_id" uuid not null, "label" varchar(80) not null, "display_prefix" varchar(16) not null, "token_hash" varchar(64) not null, "last_used_at" timestamptz null, "revoked_at" timestamptz null, "created_at" timestamptz not null, constraint "api_tokens_pkey" primary key ("id"));`);
    this.addSql(`alter table "api_tokens" add constraint "api_tokens_token_hash_unique" unique ("token_hash");`);

    this.addSql(`alter table "password_resets" add constraint "password_resets_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "memberships" add constraint "memberships_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "memberships" add constraint "memberships_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "invitations" add constraint "invitations_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "invitations" add constraint "invitations_invited_by_id_foreign" foreign key ("invited_by_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "api_tokens" add constraint "api_tokens_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "api_tokens" add constraint "api_tokens_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade;`);
  }

}
