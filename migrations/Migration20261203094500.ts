import { Migration } from '@mikro-orm/migrations';

export class Migration20261203094500 extends Migration {

  override async up(): Promise<void> {
    // A batch whose required checks were not all measured is recorded as incomplete (held), never as passed.
    this.addSql(`alter table "batch_records" drop constraint if exists "batch_records_outcome_check";`);
    this.addSql(`alter table "batch_records" add constraint "batch_records_outcome_check" check ("outcome" in ('pass', 'fail', 'incomplete'));`);

    this.addSql(`create table "batch_decisions" ("id" uuid not null, "workspace_id" uuid not null, "batch_id" uuid not null, "kind" text check ("kind" in ('retest', 'release', 'reject')) not null, "readings" jsonb null, "checks" jsonb null, "outcome" text check ("outcome" in ('pass', 'fail', 'incomplete')) null, "comment" text not null, "decided_by_id" uuid not null, "created_at" timestamptz not null, constraint "batch_decisions_pkey" primary key ("id"));`);
    this.addSql(`create index "batch_decisions_workspace_id_batch_id_index" on "batch_decisions" ("workspace_id", "batch_id");`);
    this.addSql(`alter table "batch_decisions" add constraint "batch_decisions_workspace_id_foreign" foreign key ("workspace_id") references "workspaces" ("id") on update cascade;`);
    this.addSql(`alter table "batch_decisions" add constraint "batch_decisions_batch_id_foreign" foreign key ("batch_id") references "batch_records" ("id") on update cascade;`);
    this.addSql(`alter table "batch_decisions" add constraint "batch_decisions_decided_by_id_foreign" foreign key ("decided_by_id") references "users" ("id") on update cascade;`);
    // One release or reject per batch; the insert-only trigger keeps every decision as it was made.
    this.addSql(`create unique index "batch_decisions_one_final" on "batch_decisions" ("batch_id") where "kind" in ('release', 'reject');`);
    this.addSql(`create trigger batch_decisions_insert_only before update or delete on "batch_decisions" for each row execute function insert_only_guard();`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "batch_decisions" cascade;`);
    this.addSql(`alter table "batch_records" drop constraint if exists "batch_records_outcome_check";`);
    this.addSql(`alter table "batch_records" add constraint "batch_records_outcome_check" check ("outcome" in ('pass', 'fail'));`);
  }

}
