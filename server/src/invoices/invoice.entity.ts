import { Column, Entity, Index, JoinColumn, ManyToOne, Unique } from 'typeorm';
import { SyncedEntity, type JsonObject } from '../database/synced.entity';
import { Job } from '../jobs/job.entity';

/** An invoice, numbered without gaps within the business. */
@Entity('invoices')
@Index('invoices_sync_idx', ['businessId', 'version'])
@Index('invoices_job_id_idx', ['jobId'])
@Index('invoices_business_issued_idx', ['businessId', 'issuedAt'])
@Unique('invoices_business_id_number_key', ['businessId', 'number'])
export class Invoice extends SyncedEntity {
  @Column({ type: 'uuid' })
  jobId: string;

  @ManyToOne(() => Job, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'job_id', foreignKeyConstraintName: 'FK_invoices_job_id' })
  job?: Job;

  @Column({ type: 'integer' })
  number: number;

  @Column({ type: 'timestamptz' })
  issuedAt: Date;

  @Column({ type: 'integer' })
  subtotalMinor: number;

  @Column({ type: 'integer' })
  taxMinor: number;

  @Column({ type: 'integer' })
  totalMinor: number;

  @Column({ type: 'text', default: 'USD' })
  currency: string;

  @Column({ type: 'jsonb', default: () => "'[]'" })
  lines: JsonObject[];

  /** How the tax was worked out, in words ("Tax 8 % on the taxable total, rounded half-up"). */
  @Column({ type: 'text', default: '' })
  taxLabel: string;
}
