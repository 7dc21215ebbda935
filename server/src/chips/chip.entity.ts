import { Column, Entity, Index, JoinColumn, ManyToOne } from 'typeorm';
import { numericNumber, SyncedEntity } from '../database/synced.entity';
import { Job } from '../jobs/job.entity';

/** A stone chip to fill with touch-up paint, layer by layer. */
@Entity('chips')
@Index('chips_sync_idx', ['businessId', 'version'])
@Index('chips_job_id_idx', ['jobId'])
export class Chip extends SyncedEntity {
  @Column({ type: 'uuid' })
  jobId: string;

  @ManyToOne(() => Job, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'job_id', foreignKeyConstraintName: 'FK_chips_job_id' })
  job?: Job;

  @Column({ type: 'uuid', nullable: true })
  panelId: string | null;

  @Column({ type: 'integer' })
  number: number;

  @Column({ type: 'numeric', precision: 5, scale: 1, transformer: numericNumber })
  sizeMm: number;

  @Column({ type: 'uuid', nullable: true })
  productId: string | null;

  @Column({ type: 'integer', default: 3 })
  layersPlanned: number;

  @Column({ type: 'text', default: '' })
  note: string;
}
