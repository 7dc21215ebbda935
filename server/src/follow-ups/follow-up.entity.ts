import {
  Check,
  Column,
  CreateDateColumn,
  Entity,
  Index,
  JoinColumn,
  ManyToOne,
  PrimaryColumn,
  UpdateDateColumn,
} from 'typeorm';
import { Business } from '../businesses/business.entity';
import { Job } from '../jobs/job.entity';

export const FOLLOW_UP_KINDS = ['maintenance', 'appointment'] as const;
export type FollowUpKind = (typeof FOLLOW_UP_KINDS)[number];

export const FOLLOW_UP_STATUSES = ['scheduled', 'sent', 'cancelled'] as const;
export type FollowUpStatus = (typeof FOLLOW_UP_STATUSES)[number];

/**
 * An e-mail to a customer at a later date: a maintenance reminder months after a job with
 * protection, or an appointment reminder the day before a visit. This row is the source of
 * truth; the pg-boss job that wakes the worker at `dueAt` carries the same id and is written
 * in the same transaction (see FollowUpsService).
 */
@Entity('follow_ups')
@Check('follow_ups_kind_check', `"kind" IN ('maintenance', 'appointment')`)
@Check('follow_ups_status_check', `"status" IN ('scheduled', 'sent', 'cancelled')`)
// One pending follow-up of each kind per job: a moved window replaces the old reminder.
@Index('follow_ups_pending_key', ['jobId', 'kind'], {
  unique: true,
  where: "status = 'scheduled'",
})
// One maintenance reminder per job, ever (a retried close cannot make a second one).
@Index('follow_ups_maintenance_key', ['jobId'], { unique: true, where: "kind = 'maintenance'" })
@Index('follow_ups_business_due_idx', ['businessId', 'status', 'dueAt'])
@Index('follow_ups_status_due_idx', ['status', 'dueAt'])
export class FollowUp {
  @PrimaryColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  businessId: string;

  @ManyToOne(() => Business, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'business_id', foreignKeyConstraintName: 'FK_follow_ups_business' })
  business?: Business;

  @Column({ type: 'uuid' })
  jobId: string;

  @ManyToOne(() => Job, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'job_id', foreignKeyConstraintName: 'FK_follow_ups_job' })
  job?: Job;

  @Column({ type: 'text' })
  kind: FollowUpKind;

  @Column({ type: 'timestamptz' })
  dueAt: Date;

  @Column({ type: 'text', default: 'scheduled' })
  status: FollowUpStatus;

  /** An appointment reminder: the window start it was made for (a moved window voids it). */
  @Column({ type: 'timestamptz', nullable: true })
  windowStart: Date | null;

  /** When its pg-boss job was written (null: not yet; the sweeper queues it). */
  @Column({ type: 'timestamptz', nullable: true })
  queuedAt: Date | null;

  @Column({ type: 'timestamptz', nullable: true })
  sentAt: Date | null;

  /** The outbox message it became. */
  @Column({ type: 'uuid', nullable: true })
  mailId: string | null;

  @Column({ type: 'timestamptz', nullable: true })
  cancelledAt: Date | null;

  /** Why it was not sent, in words ("The visit was moved", "Cancelled by the owner"). */
  @Column({ type: 'text', nullable: true })
  cancelReason: string | null;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}
