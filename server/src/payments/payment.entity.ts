import { Column, Entity, Index, Unique } from 'typeorm';
import { SyncedEntity } from '../database/synced.entity';

/** Money in or out: a deposit, the balance or a refund, by card, cash or cheque. `opId` makes a retry harmless. */
@Entity('payments')
@Index('payments_sync_idx', ['businessId', 'version'])
@Index('payments_job_id_idx', ['jobId'])
@Index('payments_provider_intent_idx', ['providerIntent'])
@Index('payments_business_paid_idx', ['businessId', 'paidAt'])
@Unique('payments_business_id_op_id_key', ['businessId', 'opId'])
export class Payment extends SyncedEntity {
  @Column({ type: 'uuid', nullable: true })
  jobId: string | null;

  @Column({ type: 'uuid', nullable: true })
  quoteId: string | null;

  @Column({ type: 'text' })
  kind: string;

  @Column({ type: 'text' })
  method: string;

  @Column({ type: 'integer' })
  amountMinor: number;

  @Column({ type: 'text', default: 'USD' })
  currency: string;

  @Column({ type: 'text' })
  status: string;

  @Column({ type: 'uuid' })
  opId: string;

  @Column({ type: 'text', nullable: true })
  providerRef: string | null;

  @Column({ type: 'text', nullable: true })
  checkoutUrl: string | null;

  @Column({ type: 'text', nullable: true })
  failureReason: string | null;

  @Column({ type: 'timestamptz', nullable: true })
  paidAt: Date | null;

  @Column({ type: 'uuid', nullable: true })
  recordedBy: string | null;

  /** Card payments: the provider's payment intent (`pi_…`), known once the customer pays. */
  @Column({ type: 'text', nullable: true })
  providerIntent: string | null;

  /** Refunds: the payment given back. */
  @Column({ type: 'uuid', nullable: true })
  refundOf: string | null;

  /** Card payment links: when the link stops taking payments. */
  @Column({ type: 'timestamptz', nullable: true })
  expiresAt: Date | null;
}
