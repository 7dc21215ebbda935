import { Column, Entity, Index, JoinColumn, ManyToOne } from 'typeorm';
import { SyncedEntity } from '../database/synced.entity';
import { Customer } from '../customers/customer.entity';
import { Vehicle } from '../vehicles/vehicle.entity';
import { User } from '../users/user.entity';
import type { JobStage } from '@panelpass/shared';

/** A visit: one vehicle, one address, one time window, moving through the stages. */
@Entity('jobs')
@Index('jobs_sync_idx', ['businessId', 'version'])
@Index('jobs_business_id_window_start_idx', ['businessId', 'windowStart'])
@Index('jobs_assigned_tech_id_idx', ['assignedTechId'])
@Index('jobs_customer_id_idx', ['customerId'])
@Index('jobs_vehicle_id_idx', ['vehicleId'])
export class Job extends SyncedEntity {
  @Column({ type: 'uuid' })
  customerId: string;

  @ManyToOne(() => Customer, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'customer_id', foreignKeyConstraintName: 'FK_jobs_customer_id' })
  customer?: Customer;

  @Column({ type: 'uuid' })
  vehicleId: string;

  @ManyToOne(() => Vehicle, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'vehicle_id', foreignKeyConstraintName: 'FK_jobs_vehicle_id' })
  vehicle?: Vehicle;

  @Column({ type: 'uuid', nullable: true })
  quoteId: string | null;

  @Column({ type: 'text', default: '' })
  address: string;

  @Column({ type: 'double precision', nullable: true })
  lat: number | null;

  @Column({ type: 'double precision', nullable: true })
  lng: number | null;

  @Column({ type: 'timestamptz' })
  windowStart: Date;

  @Column({ type: 'timestamptz' })
  windowEnd: Date;

  @Column({ type: 'uuid', nullable: true })
  assignedTechId: string | null;

  @ManyToOne(() => User, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'assigned_tech_id', foreignKeyConstraintName: 'FK_jobs_assigned_tech_id' })
  assignedTech?: User;

  @Column({ type: 'text', default: 'booked' })
  stage: JobStage;

  @Column({ type: 'text', default: '' })
  conditionNotes: string;

  @Column({ type: 'text', default: '' })
  notes: string;

  @Column({ type: 'integer', default: 0 })
  priceMinor: number;

  @Column({ type: 'text', array: true, default: () => "'{}'" })
  services: string[];
}
