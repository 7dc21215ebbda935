import { Column, Entity, Index } from 'typeorm';
import { SyncedEntity } from '../database/synced.entity';

/** A person whose vehicles the business looks after. */
@Entity('customers')
@Index('customers_sync_idx', ['businessId', 'version'])
export class Customer extends SyncedEntity {
  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text', nullable: true })
  email: string | null;

  @Column({ type: 'text', nullable: true })
  phone: string | null;

  @Column({ type: 'text', default: '' })
  address: string;

  @Column({ type: 'double precision', nullable: true })
  lat: number | null;

  @Column({ type: 'double precision', nullable: true })
  lng: number | null;

  @Column({ type: 'text', default: '' })
  notes: string;
}
