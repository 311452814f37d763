import { Migration } from '@mikro-orm/migrations';

/** The link from a re-submitted promotion request to the sent-back request it was filed after. */
export class Migration20261204235828 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "promotion_requests" add column "previous_request_id" uuid null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "promotion_requests" drop column "previous_request_id";`);
  }

}
