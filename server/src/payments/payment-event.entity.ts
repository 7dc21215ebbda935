import { Column, CreateDateColumn, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import { Business } from '../businesses/business.entity';

/**
 * A payment provider's webhook event already applied, by the provider's event id: an event
 * delivered twice finds its row here and changes nothing.
 */
@Entity('payment_events')
export class PaymentEvent {
  /** The provider's event id (`evt_…`). */
  @PrimaryColumn('text')
  id: string;

  @Column({ type: 'uuid' })
  businessId: string;

  @ManyToOne(() => Business, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'business_id', foreignKeyConstraintName: 'FK_payment_events_business' })
  business?: Business;

  @Column({ type: 'text' })
  type: string;

  @Column({ type: 'uuid', nullable: true })
  paymentId: string | null;

  /** What the event did: `succeeded`, `failed`, `ignored`… */
  @Column({ type: 'text' })
  outcome: string;

  @CreateDateColumn({ type: 'timestamptz' })
  receivedAt: Date;
}
