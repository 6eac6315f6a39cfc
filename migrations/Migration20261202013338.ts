import { Migration } from '@mikro-orm/migrations';

export class Migration20261202013338 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "outbox_events" ("id" serial primary key, "kind" varchar(32) not null, "payload" jsonb not null, "created_at" timestamptz not null, "indexed_at" timestamptz null, "notified_at" timestamptz null);`);
    this.addSql(`create index "outbox_events_indexed_at_index" on "outbox_events" ("indexed_at");`);
    this.addSql(`create index "outbox_events_notified_at_index" on "outbox_events" ("notified_at");`);

    this.addSql(`create table "sign_in_links" ("id" serial primary key, "email" varchar(320) not null, "token_hash" varchar(64) not null, "expires_at" timestamptz not null, "used_at" timestamptz null, "created_at" timestamptz not null);`);
    this.addSql(`create index "sign_in_links_email_index" on "sign_in_links" ("email");`);
    this.addSql(`alter table "sign_in_links" add constraint "sign_in_links_token_hash_unique" unique ("token_hash");`);

    this.addSql(`create table "teams" ("id" serial primary key, "slug" varchar(64) not null, "name" varchar(200) not null, "created_at" timestamptz not null);`);
    this.addSql(`alter table "teams" add constraint "teams_slug_unique" unique ("slug");`);

    this.addSql(`create table "users" ("id" serial primary key, "email" varchar(320) not null, "name" varchar(200) not null, "password_hash" varchar(255) null, "created_at" timestamptz not null);`);
    this.addSql(`alter table "users" add constraint "users_email_unique" unique ("email");`);

    this.addSql(`create table "memberships" ("id" serial primary key, "user_id" int not null, "team_id" int not null, "role" varchar(16) not null, "created_at" timestamptz not null);`);
    this.addSql(`alter table "memberships" add constraint "memberships_user_id_team_id_unique" unique ("user_id", "team_id");`);

    this.addSql(`create table "invitations" ("id" serial primary key, "team_id" int not null, "email" varchar(320) not null, "role" varchar(16) not null, "token_hash" varchar(64) not null, "invited_by_id" int not null, "expires_at" timestamptz not null, "accepted_at" timestamptz null, "created_at" timestamptz not null);`);
    this.addSql(`alter table "invitations" add constraint "invitations_token_hash_unique" unique ("token_hash");`);

    this.addSql(`create table "blocks" ("id" serial primary key, "slug" varchar(100) not null, "team_id" int not null, "title" varchar(200) not null, "summary" text not null default '', "category" varchar(16) not null, "tags" jsonb not null default '[]', "hazard" jsonb not null default '[]', "visibility" varchar(8) not null default 'team', "head_id" int null, "forked_from_id" int null, "archived" boolean not null default false, "created_at" timestamptz not null, "updated_at" timestamptz not null);`);
    this.addSql(`alter table "blocks" add constraint "blocks_slug_unique" unique ("slug");`);

    this.addSql(`create table "block_versions" ("id" serial primary key, "block_id" int not null, "number" int not null, "text" text not null, "params" jsonb not null, "content_hash" varchar(64) not null, "author_id" int not null, "message" text not null default '', "created_at" timestamptz not null);`);
    this.addSql(`create index "block_versions_content_hash_index" on "block_versions" ("content_hash");`);
    this.addSql(`alter table "block_versions" add constraint "block_versions_block_id_number_unique" unique ("block_id", "number");`);

    this.addSql(`create table "reviews" ("id" serial primary key, "version_id" int not null, "reviewer_id" int null, "requested_by_id" int null, "decision" varchar(24) not null, "comment" text not null default '', "created_at" timestamptz not null);`);

    this.addSql(`create table "check_runs" ("id" uuid not null, "version_id" int not null, "status" varchar(16) not null default 'queued', "report" jsonb null, "waveforms" jsonb null, "engine_version" varchar(32) null, "ngspice_version" varchar(64) null, "model_library_hash" varchar(64) null, "duration_ms" int null, "attempts" int not null default 0, "trigger" varchar(16) not null default 'new-version', "error" text null, "created_at" timestamptz not null, "started_at" timestamptz null, "finished_at" timestamptz null, constraint "check_runs_pkey" primary key ("id"));`);
    this.addSql(`create index "check_runs_version_id_created_at_index" on "check_runs" ("version_id", "created_at");`);
    this.addSql(`create index "check_runs_status_index" on "check_runs" ("status");`);

    this.addSql(`create table "attachments" ("id" serial primary key, "block_id" int not null, "name" varchar(200) not null, "content_type" varchar(100) not null, "size" int not null, "sha256" varchar(64) not null, "bytes" bytea not null, "uploaded_by_id" int not null, "created_at" timestamptz not null);`);
    this.addSql(`alter table "attachments" add constraint "attachments_block_id_name_unique" unique ("block_id", "name");`);

    this.addSql(`create table "api_tokens" ("id" serial primary key, "user_id" int not null, "team_id" int not null, "name" varchar(100) not null, "hash" varchar(64) not null, "prefix" varchar(16) not null, "scope" varchar(8) not null, "expires_at" timestamptz null, "last_used_at" timestamptz null, "revoked_at" timestamptz null, "created_at" timestamptz not null);`);
    this.addSql(`alter table "api_tokens" add constraint "api_tokens_hash_unique" unique ("hash");`);

    this.addSql(`create table "watches" ("id" serial primary key, "user_id" int not null, "block_id" int not null, "created_at" timestamptz not null);`);
    this.addSql(`alter table "watches" add constraint "watches_user_id_block_id_unique" unique ("user_id", "block_id");`);

    this.addSql(`alter table "memberships" add constraint "memberships_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "memberships" add constraint "memberships_team_id_foreign" foreign key ("team_id") references "teams" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "invitations" add constraint "invitations_team_id_foreign" foreign key ("team_id") references "teams" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "invitations" add constraint "invitations_invited_by_id_foreign" foreign key ("invited_by_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "blocks" add constraint "blocks_team_id_foreign" foreign key ("team_id") references "teams" ("id") on update cascade;`);
    this.addSql(`alter table "blocks" add constraint "blocks_head_id_foreign" foreign key ("head_id") references "block_versions" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "blocks" add constraint "blocks_forked_from_id_foreign" foreign key ("forked_from_id") references "block_versions" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "block_versions" add constraint "block_versions_block_id_foreign" foreign key ("block_id") references "blocks" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "block_versions" add constraint "block_versions_author_id_foreign" foreign key ("author_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "reviews" add constraint "reviews_version_id_foreign" foreign key ("version_id") references "block_versions" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "reviews" add constraint "reviews_reviewer_id_foreign" foreign key ("reviewer_id") references "users" ("id") on update cascade on delete set null;`);
    this.addSql(`alter table "reviews" add constraint "reviews_requested_by_id_foreign" foreign key ("requested_by_id") references "users" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "check_runs" add constraint "check_runs_version_id_foreign" foreign key ("version_id") references "block_versions" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "attachments" add constraint "attachments_block_id_foreign" foreign key ("block_id") references "blocks" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "attachments" add constraint "attachments_uploaded_by_id_foreign" foreign key ("uploaded_by_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "api_tokens" add constraint "api_tokens_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "api_tokens" add constraint "api_tokens_team_id_foreign" foreign key ("team_id") references "teams" ("id") on update cascade on delete cascade;`);

    this.addSql(`alter table "watches" add constraint "watches_user_id_foreign" foreign key ("user_id") references "users" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "watches" add constraint "watches_block_id_foreign" foreign key ("block_id") references "blocks" ("id") on update cascade on delete cascade;`);
  }

}
