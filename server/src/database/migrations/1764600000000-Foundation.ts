import { MigrationInterface, QueryRunner } from 'typeorm';

/** Businesses, people who sign in, their refresh-token families, and helper invites. */
export class Foundation1764600000000 implements MigrationInterface {
  name = 'Foundation1764600000000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE "businesses" (
      "id" uuid NOT NULL DEFAULT gen_random_uuid(),
      "name" text NOT NULL,
      "created_at" timestamptz NOT NULL DEFAULT now(),
      "updated_at" timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT "PK_businesses" PRIMARY KEY ("id"))`);
    await q.query(`CREATE TABLE "users" (
      "id" uuid NOT NULL DEFAULT gen_random_uuid(),
      "business_id" uuid NOT NULL,
      "email" text NOT NULL,
      "name" text NOT NULL,
      "role" text NOT NULL,
      "password_hash" text,
      "created_at" timestamptz NOT NULL DEFAULT now(),
      "updated_at" timestamptz NOT NULL DEFAULT now(),
      "deleted_at" timestamptz,
      CONSTRAINT "PK_users" PRIMARY KEY ("id"),
      CONSTRAINT "users_role_check" CHECK ("role" IN ('owner', 'tech', 'customer')),
      CONSTRAINT "FK_users_business" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE)`);
    await q.query(`CREATE UNIQUE INDEX "users_email_key" ON "users" ("email")`);
    await q.query(`CREATE INDEX "users_business_idx" ON "users" ("business_id")`);
    await q.query(`CREATE TABLE "refresh_tokens" (
      "id" uuid NOT NULL,
      "family_id" uuid NOT NULL,
      "user_id" uuid NOT NULL,
      "secret_hash" text NOT NULL,
      "expires_at" timestamptz NOT NULL,
      "used_at" timestamptz,
      "revoked_at" timestamptz,
      "created_at" timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT "PK_refresh_tokens" PRIMARY KEY ("id"),
      CONSTRAINT "FK_refresh_tokens_user" FOREIGN KEY ("user_id") REFERENCES "users"("id") ON DELETE CASCADE)`);
    await q.query(`CREATE INDEX "refresh_tokens_family_idx" ON "refresh_tokens" ("family_id")`);
    await q.query(`CREATE TABLE "invites" (
      "id" uuid NOT NULL DEFAULT gen_random_uuid(),
      "business_id" uuid NOT NULL,
      "email" text NOT NULL,
      "name" text NOT NULL,
      "role" text NOT NULL DEFAULT 'tech',
      "token_hash" text NOT NULL,
      "created_by" uuid NOT NULL,
      "expires_at" timestamptz NOT NULL,
      "accepted_at" timestamptz,
      "revoked_at" timestamptz,
      "created_at" timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT "PK_invites" PRIMARY KEY ("id"),
      CONSTRAINT "FK_invites_business" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE)`);
    await q.query(`CREATE UNIQUE INDEX "invites_token_hash_key" ON "invites" ("token_hash")`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "invites"`);
    await q.query(`DROP TABLE "refresh_tokens"`);
    await q.query(`DROP TABLE "users"`);
    await q.query(`DROP TABLE "businesses"`);
  }
}
