import { Migration } from '@mikro-orm/migrations';

export class Migration20261202092600 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "ended_sessions" ("sid" uuid not null, "user_id" int not null, "ended_at" timestamptz not null, "expires_at" timestamptz not null, constraint "ended_sessions_pkey" primary key ("sid"));`);
    this.addSql(`create index "ended_sessions_expires_at_index" on "ended_sessions" ("expires_at");`);
  }

  override async down(): Promise<void> {
    this.addSql(`drop table if exists "ended_sessions" cascade;`);
  }

}
