import { MigrationInterface, QueryRunner } from 'typeorm';

/** Per-device push progress, refused mutations, and the scope number of each person. */
export class Sync1764600002000 implements MigrationInterface {
  name = 'Sync1764600002000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE "sync_clients" (
      "client_id" uuid NOT NULL,
      "business_id" uuid NOT NULL,
      "user_id" uuid NOT NULL,
      "last_mutation_id" bigint NOT NULL DEFAULT 0,
      "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      CONSTRAINT "PK_sync_clients" PRIMARY KEY ("client_id"))`);
    await q.query(`CREATE INDEX "sync_clients_user_idx" ON "sync_clients" ("user_id")`);
    await q.query(`CREATE TABLE "sync_rejections" (
      "id" BIGSERIAL NOT NULL,
      "client_id" uuid NOT NULL,
      "business_id" uuid NOT NULL,
      "mutation_id" bigint NOT NULL,
      "name" text NOT NULL,
      "code" text NOT NULL,
      "message" text NOT NULL,
      "details" jsonb,
      "at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      CONSTRAINT "PK_sync_rejections" PRIMARY KEY ("id"))`);
    await q.query(
      `CREATE UNIQUE INDEX "sync_rejections_client_idx" ON "sync_rejections" ("client_id", "mutation_id")`,
    );
    await q.query(`ALTER TABLE "users" ADD "scope_epoch" integer NOT NULL DEFAULT 0`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "users" DROP COLUMN "scope_epoch"`);
    await q.query(`DROP TABLE "sync_rejections"`);
    await q.query(`DROP TABLE "sync_clients"`);
  }
}
