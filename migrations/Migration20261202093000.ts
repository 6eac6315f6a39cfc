import { Migration } from '@mikro-orm/migrations';

export class Migration20261202093000 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "sim_results" ("run_id" uuid not null, "key" varchar(64) not null, "ok" boolean not null, "raw" bytea null, "error" text null, "line" int null, "ms" double precision not null, "cached" boolean not null, "worker_id" varchar(64) not null, "created_at" timestamptz not null, constraint "sim_results_pkey" primary key ("run_id", "key"));`);
    this.addSql(`create index "sim_results_created_at_index" on "sim_results" ("created_at");`);

    this.addSql(`alter table "sim_results" add constraint "sim_results_run_id_foreign" foreign key ("run_id") references "check_runs" ("id") on update cascade on delete cascade;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "sim_results" cascade;`);
  }

}
