import { Column, Entity, Index, JoinColumn, ManyToOne } from 'typeorm';
import { SyncedEntity } from '../database/synced.entity';
import { Job } from '../jobs/job.entity';

/** Tape or cover protecting trim, vinyl edges or emblems; remove it by `removeBy`. */
@Entity('masking_items')
@Index('masking_items_sync_idx', ['businessId', 'version'])
@Index('masking_items_job_id_idx', ['jobId'])
export class MaskingItem extends SyncedEntity {
  @Column({ type: 'uuid' })
  jobId: string;

  @ManyToOne(() => Job, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'job_id', foreignKeyConstraintName: 'FK_masking_items_job_id' })
  job?: Job;

  @Column({ type: 'text' })
  what: string;

  @Column({ type: 'uuid', nullable: true })
  panelId: string | null;

  @Column({ type: 'uuid', nullable: true })
  productId: string | null;

  @Column({ type: 'timestamptz' })
  appliedAt: Date;

  @Column({ type: 'timestamptz' })
  removeBy: Date;

  @Column({ type: 'timestamptz', nullable: true })
  removedAt: Date | null;
}
