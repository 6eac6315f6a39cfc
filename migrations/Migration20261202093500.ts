import { Migration } from '@mikro-orm/migrations';

export class Migration20261202093500 extends Migration {

  override async up(): Promise<void> {
    this.addSql(`create table "models" ("id" serial primary key, "team_id" int not null, "name" varchar(100) not null, "head_id" int null, "created_at" timestamptz not null, "updated_at" timestamptz not null);`);
    this.addSql(`alter table "models" add constraint "models_team_id_name_unique" unique ("team_id", "name");`);

    this.addSql(`create table "model_versions" ("id" serial primary key, "model_id" int not null, "number" int not null, "text" text not null, "sha256" varchar(64) not null, "defines" jsonb not null, "author_id" int not null, "message" text not null default '', "created_at" timestamptz not null);`);
    this.addSql(`create index "model_versions_sha256_index" on "model_versions" ("sha256");`);
    this.addSql(`alter table "model_versions" add constraint "model_versions_model_id_number_unique" unique ("model_id", "number");`);

    this.addSql(`alter table "models" add constraint "models_team_id_foreign" foreign key ("team_id") references "teams" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "models" add constraint "models_head_id_foreign" foreign key ("head_id") references "model_versions" ("id") on update cascade on delete set null;`);

    this.addSql(`alter table "model_versions" add constraint "model_versions_model_id_foreign" foreign key ("model_id") references "models" ("id") on update cascade on delete cascade;`);
    this.addSql(`alter table "model_versions" add constraint "model_versions_author_id_foreign" foreign key ("author_id") references "users" ("id") on update cascade;`);

    this.addSql(`alter table "check_runs" add column "models" jsonb null, add column "models_outdated" boolean not null default false;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "model_versions" drop constraint "model_versions_model_id_foreign";`);

    this.addSql(`alter table "models" drop constraint "models_head_id_foreign";`);

    this.addSql(`drop table if exists "models" cascade;`);

    this.addSql(`drop table if exists "model_versions" cascade;`);

    this.addSql(`alter table "check_runs" drop column "models", drop column "models_outdated";`);
  }

}
