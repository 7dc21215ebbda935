import { Column, Entity, Index, JoinColumn, ManyToOne } from 'typeorm';
import { SyncedEntity } from '../database/synced.entity';
import { Customer } from '../customers/customer.entity';

/** A customer's vehicle; its body style picks the panel template. */
@Entity('vehicles')
@Index('vehicles_sync_idx', ['businessId', 'version'])
@Index('vehicles_customer_id_idx', ['customerId'])
export class Vehicle extends SyncedEntity {
  @Column({ type: 'uuid' })
  customerId: string;

  @ManyToOne(() => Customer, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'customer_id', foreignKeyConstraintName: 'FK_vehicles_customer_id' })
  customer?: Customer;

  @Column({ type: 'text', default: '' })
  make: string;

  @Column({ type: 'text', default: '' })
  model: string;

  @Column({ type: 'integer', nullable: true })
  year: number | null;

  @Column({ type: 'text' })
  bodyStyle: string;

  @Column({ type: 'text', default: '' })
  colour: string;

  @Column({ type: 'text', default: '' })
  paintNotes: string;

  @Column({ type: 'text', nullable: true })
  plate: string | null;
}
