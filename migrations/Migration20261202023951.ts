import { Migration } from '@mikro-orm/migrations';

export class Migration20261202023951 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "users" add column "sessions_valid_from" timestamptz null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "users" drop column "sessions_valid_from";`);
  }

}
