import { Migration } from '@mikro-orm/migrations';

export class Migration20261202170000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "sim_results" add column "raw_in_cache" boolean not null default false;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "sim_results" drop column "raw_in_cache";`);
  }

}
