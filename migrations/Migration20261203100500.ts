import { Migration } from '@mikro-orm/migrations';

/** Cooks can be corrected or withdrawn; each change is kept, insert-only, with the values it replaced. */
export class Migration20261203100500 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "measurements" add column "withdrawn_at" timestamptz null;`);
    this.addSql(`create table "measurement_changes" ("id" uuid not null, "workspace_id" uuid not null, "measurement_id" uuid not null, "kind" text check ("kind" in ('corrected', 'withdrawn')) not null, "before" jsonb not null, "reason" text not null, "changed_by_id" uuid not null, "changed_at" timestamptz not null, constraint "measurement_changes_pkey" primary key ("id"));`);
    this.addSql(`create index "measurement_changes_workspace_id_measurement_id_index" on "measurement_changes" ("workspace_id", "measurement_id");`);
    this.addSql(`alter table "measurement_changes" add constraint "measurement_changes_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "measurement_changes" add constraint "measurement_changes_measurement_id_foreign" foreign key ("measurement_id") references "measurements" ("id") on update cascade;`);
    this.addSql(`alter table "measurement_changes" add constraint "measurement_changes_changed_by_id_foreign" foreign key ("changed_by_id") references "users" ("id") on update cascade;`);
    this.addSql(`create trigger measurement_changes_insert_only before update or delete on "measurement_changes" for each row execute function insert_only_guard();`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop trigger if exists measurement_changes_insert_only on "measurement_changes";`);
    this.addSql(`drop table if exists "measurement_changes" cascade;`);
    this.addSql(`alter table "measurements" drop column "withdrawn_at";`);
  }

}
