import { Column, Entity, Index, JoinColumn, ManyToOne } from 'typeorm';
import { bigintNumber, SyncedEntity } from '../database/synced.entity';
import { Job } from '../jobs/job.entity';

/** A wait with an absolute end time (never a counting tick), so it survives sleep and a second device. */
@Entity('timers')
@Index('timers_sync_idx', ['businessId', 'version'])
@Index('timers_job_id_idx', ['jobId'])
@Index('timers_business_id_ends_at_idx', ['businessId', 'endsAt'])
export class Timer extends SyncedEntity {
  @Column({ type: 'uuid', nullable: true })
  jobId: string | null;

  @ManyToOne(() => Job, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'job_id', foreignKeyConstraintName: 'FK_timers_job_id' })
  job?: Job;

  @Column({ type: 'text' })
  kind: string;

  @Column({ type: 'text', nullable: true })
  subjectType: string | null;

  @Column({ type: 'uuid', nullable: true })
  subjectId: string | null;

  @Column({ type: 'text' })
  label: string;

  @Column({ type: 'timestamptz' })
  startedAt: Date;

  @Column({ type: 'timestamptz' })
  endsAt: Date;

  @Column({ type: 'bigint', default: 0, transformer: bigintNumber })
  pausedMs: number;

  @Column({ type: 'timestamptz', nullable: true })
  pausedAt: Date | null;

  @Column({ type: 'timestamptz', nullable: true })
  acknowledgedAt: Date | null;

  @Column({ type: 'timestamptz', nullable: true })
  cancelledAt: Date | null;

  @Column({ type: 'uuid' })
  startedBy: string;
}
