import { Migration } from '@mikro-orm/migrations';

export class Migration20261202090500 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`alter table "check_runs" add column "job_id" uuid null, add column "progress_done" int not null default 0, add column "progress_total" int not null default 0;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "check_runs" drop column "job_id", drop column "progress_done", drop column "progress_total";`);
  }

}
