import { Column, Entity, Index, JoinColumn, ManyToOne } from 'typeorm';
import { numericNumber, SyncedEntity } from '../database/synced.entity';
import { Job } from '../jobs/job.entity';

/** A solvent put on the paint (tar, sap, fallout); it must be flushed off by `flushBy`. */
@Entity('solvent_applications')
@Index('solvent_applications_sync_idx', ['businessId', 'version'])
@Index('solvent_applications_job_id_idx', ['jobId'])
export class SolventApplication extends SyncedEntity {
  @Column({ type: 'uuid' })
  jobId: string;

  @ManyToOne(() => Job, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'job_id', foreignKeyConstraintName: 'FK_solvent_applications_job_id' })
  job?: Job;

  @Column({ type: 'uuid', nullable: true })
  panelId: string | null;

  @Column({ type: 'uuid', nullable: true })
  productId: string | null;

  @Column({ type: 'numeric', precision: 5, scale: 1, transformer: numericNumber })
  surfaceTempC: number;

  @Column({ type: 'boolean', default: false })
  inSun: boolean;

  @Column({ type: 'timestamptz' })
  appliedAt: Date;

  @Column({ type: 'timestamptz' })
  flushBy: Date;

  @Column({ type: 'timestamptz', nullable: true })
  flushedAt: Date | null;

  @Column({ type: 'uuid' })
  appliedBy: string;
}
