import { Migration } from '@mikro-orm/migrations';

export class Migration20261202014357 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "worker_heartbeats" ("id" varchar(64) not null, "host" varchar(200) not null, "pid" int not null, "run_id" uuid null, "started_at" timestamptz not null, "seen_at" timestamptz not null, constraint "worker_heartbeats_pkey" primary key ("id"));`);
    this.addSql(`create index "worker_heartbeats_seen_at_index" on "worker_heartbeats" ("seen_at");`);

    this.addSql(`alter table "check_runs" add column "leased_by" varchar(64) null, add column "lease_until" timestamptz null;`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "worker_heartbeats" cascade;`);

    this.addSql(`alter table "check_runs" drop column "leased_by", drop column "lease_until";`);
  }

}
