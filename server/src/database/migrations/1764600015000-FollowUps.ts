import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Follow-ups: maintenance and appointment reminder e-mails due at a later date. The timer that
 * wakes the worker is a pg-boss job (pg-boss keeps its own tables in the `pgboss` schema and
 * migrates them itself); this table is the record of what is due, sent or cancelled.
 */
export class FollowUps1764600015000 implements MigrationInterface {
  name = 'FollowUps1764600015000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE "follow_ups" (
      "id" uuid NOT NULL,
      "business_id" uuid NOT NULL,
      "job_id" uuid NOT NULL,
      "kind" text NOT NULL,
      "due_at" TIMESTAMP WITH TIME ZONE NOT NULL,
      "status" text NOT NULL DEFAULT 'scheduled',
      "window_start" TIMESTAMP WITH TIME ZONE,
      "queued_at" TIMESTAMP WITH TIME ZONE,
      "sent_at" TIMESTAMP WITH TIME ZONE,
      "mail_id" uuid,
      "cancelled_at" TIMESTAMP WITH TIME ZONE,
      "cancel_reason" text,
      "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
      CONSTRAINT "PK_follow_ups" PRIMARY KEY ("id"),
      CONSTRAINT "follow_ups_kind_check" CHECK ("kind" IN ('maintenance', 'appointment')),
      CONSTRAINT "follow_ups_status_check" CHECK ("status" IN ('scheduled', 'sent', 'cancelled')),
      CONSTRAINT "FK_follow_ups_business" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE,
      CONSTRAINT "FK_follow_ups_job" FOREIGN KEY ("job_id") REFERENCES "jobs"("id") ON DELETE CASCADE)`);
    await q.query(
      `CREATE UNIQUE INDEX "follow_ups_pending_key" ON "follow_ups" ("job_id", "kind") WHERE status = 'scheduled'`,
    );
    await q.query(
      `CREATE UNIQUE INDEX "follow_ups_maintenance_key" ON "follow_ups" ("job_id") WHERE kind = 'maintenance'`,
    );
    await q.query(
      `CREATE INDEX "follow_ups_business_due_idx" ON "follow_ups" ("business_id", "status", "due_at")`,
    );
    await q.query(`CREATE INDEX "follow_ups_status_due_idx" ON "follow_ups" ("status", "due_at")`);
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE "follow_ups"`);
  }
}
