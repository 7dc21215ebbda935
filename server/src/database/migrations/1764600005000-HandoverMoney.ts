import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Handover and money: card payments (the provider's payment intent, refunds pointing at what
 * they give back, link expiry), provider webhook events already applied, the e-mail outbox,
 * customers' sign-in links, and how an invoice's tax was worked out.
 */
export class HandoverMoney1764600005000 implements MigrationInterface {
  name = 'HandoverMoney1764600005000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE "payments" ADD "provider_intent" text`);
    await q.query(`ALTER TABLE "payments" ADD "refund_of" uuid`);
    await q.query(`ALTER TABLE "payments" ADD "expires_at" TIMESTAMP WITH TIME ZONE`);
    await q.query(`CREATE INDEX "payments_provider_intent_idx" ON "payments" ("provider_intent")`);
    await q.query(`ALTER TABLE "invoices" ADD "tax_label" text NOT NULL DEFAULT ''`);
    await q.query(`CREATE TABLE "payment_events" (
      "id" text NOT NULL,
      "business_id" uuid NOT NULL,
      "type" text NOT NULL,
      "payment_id" uuid,
      "outcome" text NOT NULL,
      "received_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      CONSTRAINT "PK_payment_events" PRIMARY KEY ("id"),
      CONSTRAINT "FK_payment_events_business" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE)`);
    await q.query(`CREATE TABLE "outbound_mail" (
      "id" uuid NOT NULL,
      "business_id" uuid NOT NULL,
      "kind" text NOT NULL,
      "subject_id" uuid,
      "to_address" text NOT NULL,
      "subject" text NOT NULL,
      "text" text NOT NULL,
      "html" text NOT NULL DEFAULT '',
      "attachments" jsonb NOT NULL DEFAULT '[]',
      "status" text NOT NULL DEFAULT 'pending',
      "attempts" integer NOT NULL DEFAULT 0,
      "next_attempt_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      "last_error" text,
      "message_id" text NOT NULL,
      "sent_at" TIMESTAMP WITH TIME ZONE,
      "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      CONSTRAINT "PK_outbound_mail" PRIMARY KEY ("id"),
      CONSTRAINT "FK_outbound_mail_business" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE)`);
    await q.query(
      `CREATE INDEX "outbound_mail_due_idx" ON "outbound_mail" ("status", "next_attempt_at")`,
    );
    await q.query(
      `CREATE INDEX "outbound_mail_business_idx" ON "outbound_mail" ("business_id", "created_at")`,
    );
    await q.query(`CREATE TABLE "customer_links" (
      "id" uuid NOT NULL DEFAULT gen_random_uuid(),
      "business_id" uuid NOT NULL,
      "customer_id" uuid NOT NULL,
      "token_hash" text NOT NULL,
      "sent_to" text NOT NULL,
      "created_by" uuid NOT NULL,
      "expires_at" TIMESTAMP WITH TIME ZONE NOT NULL,
      "used_at" TIMESTAMP WITH TIME ZONE,
      "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      CONSTRAINT "PK_customer_links" PRIMARY KEY ("id"),
      CONSTRAINT "FK_customer_links_business" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE,
      CONSTRAINT "FK_customer_links_customer" FOREIGN KEY ("customer_id") REFERENCES "customers"("id") ON DELETE CASCADE)`);
    await q.query(
      `CREATE UNIQUE INDEX "customer_links_token_hash_key" ON "customer_links" ("token_hash")`,
    );
    await q.query(`CREATE INDEX "customer_links_customer_idx" ON "customer_links" ("customer_id")`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "customer_links"`);
    await q.query(`DROP TABLE "outbound_mail"`);
    await q.query(`DROP TABLE "payment_events"`);
    await q.query(`ALTER TABLE "invoices" DROP COLUMN "tax_label"`);
    await q.query(`DROP INDEX "payments_provider_intent_idx"`);
    await q.query(`ALTER TABLE "payments" DROP COLUMN "expires_at"`);
    await q.query(`ALTER TABLE "payments" DROP COLUMN "refund_of"`);
    await q.query(`ALTER TABLE "payments" DROP COLUMN "provider_intent"`);
  }
}
