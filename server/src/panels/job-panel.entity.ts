import { Column, Entity, Index, JoinColumn, ManyToOne, Unique } from 'typeorm';
import { numericNumber, SyncedEntity } from '../database/synced.entity';
import { Job } from '../jobs/job.entity';

/** One panel of a job's vehicle, from the body-style template, top to bottom. */
@Entity('job_panels')
@Index('job_panels_sync_idx', ['businessId', 'version'])
@Index('job_panels_job_id_idx', ['jobId'])
@Unique('job_panels_job_id_panel_key_key', ['jobId', 'panelKey'])
export class JobPanel extends SyncedEntity {
  @Column({ type: 'uuid' })
  jobId: string;

  @ManyToOne(() => Job, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'job_id', foreignKeyConstraintName: 'FK_job_panels_job_id' })
  job?: Job;

  @Column({ type: 'text' })
  panelKey: string;

  @Column({ type: 'text' })
  label: string;

  @Column({ type: 'text' })
  band: string;

  @Column({ type: 'integer' })
  position: number;

  /** What the panel is made of (steel, aluminium, plastic, composite): decides which gauge reads it. */
  @Column({ type: 'text' })
  substrate: string;

  /** What is on top: clear-coat, single-stage, gloss-black-trim, vinyl, chrome, textured-plastic. */
  @Column({ type: 'text', default: 'clear-coat' })
  finish: string;

  @Column({ type: 'text', nullable: true })
  hardness: string | null;

  @Column({ type: 'text', default: 'todo' })
  state: string;

  @Column({ type: 'numeric', precision: 6, scale: 3, default: 0, transformer: numericNumber })
  areaM2: number;

  @Column({ type: 'numeric', precision: 7, scale: 2, nullable: true, transformer: numericNumber })
  clearEstimateUm: number | null;

  @Column({ type: 'text', default: '' })
  testSpotNote: string;
}
