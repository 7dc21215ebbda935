import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The Ledger reads a business's quotes, invoices and payments by date (when written, issued,
 * paid). Without these it read all of the business's rows through the sync index and filtered
 * them (see docs/scale.md), so a range of a month cost as much as the business's whole history.
 */
export class LedgerIndexes1764600023000 implements MigrationInterface {
  name = 'LedgerIndexes1764600023000';

  public async up(q: QueryRunner): Promise<void> {
    await q.query(
      `CREATE INDEX "quotes_business_created_idx" ON "quotes" ("business_id", "created_at")`,
    );
    await q.query(
      `CREATE INDEX "invoices_business_issued_idx" ON "invoices" ("business_id", "issued_at")`,
    );
    await q.query(
      `CREATE INDEX "payments_business_paid_idx" ON "payments" ("business_id", "paid_at")`,
    );
  }

  public async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX "payments_business_paid_idx"`);
    await q.query(`DROP INDEX "invoices_business_issued_idx"`);
    await q.query(`DROP INDEX "quotes_business_created_idx"`);
  }
}
