import { Migration } from '@mikro-orm/migrations';

export class Migration20261203100100 extends Migration {

  override async up(): Promise<void> {
    // A session carries the epoch it was signed in under; raising it ends every earlier session.
    this.addSql(`alter table "users" add column "session_epoch" int not null default 0;`);
    this.addSql(`create index "password_resets_user_id_used_at_index" on "password_resets" ("user_id", "used_at");`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop index if exists "password_resets_user_id_used_at_index";`);
    this.addSql(`alter table "users" drop column "session_epoch";`);
  }

}
