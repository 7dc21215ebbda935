import { Column, Entity, Index, JoinColumn, ManyToOne } from 'typeorm';
import { SyncedEntity } from '../database/synced.entity';
import { Job } from '../jobs/job.entity';
import { Chip } from './chip.entity';

/** One thin layer of touch-up paint in a chip (append-only). */
@Entity('chip_layers')
@Index('chip_layers_sync_idx', ['businessId', 'version'])
@Index('chip_layers_chip_id_idx', ['chipId'])
@Index('chip_layers_job_id_idx', ['jobId'])
export class ChipLayer extends SyncedEntity {
  @Column({ type: 'uuid' })
  jobId: string;

  @ManyToOne(() => Job, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'job_id', foreignKeyConstraintName: 'FK_chip_layers_job_id' })
  job?: Job;

  @Column({ type: 'uuid' })
  chipId: string;

  @ManyToOne(() => Chip, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'chip_id', foreignKeyConstraintName: 'FK_chip_layers_chip_id' })
  chip?: Chip;

  @Column({ type: 'timestamptz' })
  appliedAt: Date;

  @Column({ type: 'uuid', nullable: true })
  productId: string | null;

  @Column({ type: 'uuid' })
  appliedBy: string;
}
