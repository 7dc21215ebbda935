import { Column, Entity, Index, JoinColumn, ManyToOne, Unique } from 'typeorm';
import { SyncedEntity } from '../database/synced.entity';
import { Job } from '../jobs/job.entity';

/** One step of a stage's checklist (wash, decontamination, final inspection…). */
@Entity('checklist_items')
@Index('checklist_items_sync_idx', ['businessId', 'version'])
@Index('checklist_items_job_id_idx', ['jobId'])
@Unique('checklist_items_job_id_key_key', ['jobId', 'key'])
export class ChecklistItem extends SyncedEntity {
  @Column({ type: 'uuid' })
  jobId: string;

  @ManyToOne(() => Job, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'job_id', foreignKeyConstraintName: 'FK_checklist_items_job_id' })
  job?: Job;

  @Column({ type: 'text' })
  stage: string;

  @Column({ type: 'text' })
  key: string;

  @Column({ type: 'text' })
  label: string;

  @Column({ type: 'integer', default: 0 })
  position: number;

  @Column({ type: 'boolean', default: false })
  done: boolean;

  @Column({ type: 'timestamptz', nullable: true })
  doneAt: Date | null;

  @Column({ type: 'uuid', nullable: true })
  doneBy: string | null;
}
