import { Column, Entity, Index, JoinColumn, ManyToOne } from 'typeorm';
import { numericNumber, SyncedEntity, type JsonObject } from '../database/synced.entity';
import { Customer } from '../customers/customer.entity';
import { Vehicle } from '../vehicles/vehicle.entity';

/** A price offered for a vehicle; totals come from the pricing of @panelpass/shared. */
@Entity('quotes')
@Index('quotes_sync_idx', ['businessId', 'version'])
@Index('quotes_customer_id_idx', ['customerId'])
@Index('quotes_business_created_idx', ['businessId', 'createdAt'])
export class Quote extends SyncedEntity {
  @Column({ type: 'uuid' })
  customerId: string;

  @ManyToOne(() => Customer, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'customer_id', foreignKeyConstraintName: 'FK_quotes_customer_id' })
  customer?: Customer;

  @Column({ type: 'uuid' })
  vehicleId: string;

  @ManyToOne(() => Vehicle, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'vehicle_id', foreignKeyConstraintName: 'FK_quotes_vehicle_id' })
  vehicle?: Vehicle;

  @Column({ type: 'text', default: 'draft' })
  status: string;

  @Column({ type: 'jsonb', default: () => "'{}'" })
  inputs: JsonObject;

  @Column({ type: 'integer', default: 0 })
  subtotalMinor: number;

  @Column({ type: 'integer', default: 0 })
  discountMinor: number;

  @Column({ type: 'integer', default: 0 })
  taxMinor: number;

  @Column({ type: 'integer', default: 0 })
  totalMinor: number;

  @Column({ type: 'integer', default: 0 })
  depositMinor: number;

  @Column({ type: 'numeric', precision: 6, scale: 2, default: 0, transformer: numericNumber })
  labourHours: number;

  @Column({ type: 'text', default: 'USD' })
  currency: string;

  @Column({ type: 'timestamptz', nullable: true })
  validUntil: Date | null;

  @Column({ type: 'timestamptz', nullable: true })
  sentAt: Date | null;

  @Column({ type: 'timestamptz', nullable: true })
  acceptedAt: Date | null;

  @Column({ type: 'uuid', nullable: true })
  jobId: string | null;
}
