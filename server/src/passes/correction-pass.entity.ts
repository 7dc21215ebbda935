import { Column, Entity, Index, JoinColumn, ManyToOne } from 'typeorm';
import { SyncedEntity } from '../database/synced.entity';
import { Job } from '../jobs/job.entity';
import { JobPanel } from '../panels/job-panel.entity';

/** A machine pass set on one panel (append-only log). */
@Entity('correction_passes')
@Index('correction_passes_sync_idx', ['businessId', 'version'])
@Index('correction_passes_job_id_idx', ['jobId'])
@Index('correction_passes_panel_id_idx', ['panelId'])
export class CorrectionPass extends SyncedEntity {
  @Column({ type: 'uuid' })
  jobId: string;

  @ManyToOne(() => Job, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'job_id', foreignKeyConstraintName: 'FK_correction_passes_job_id' })
  job?: Job;

  @Column({ type: 'uuid' })
  panelId: string;

  @ManyToOne(() => JobPanel, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'panel_id', foreignKeyConstraintName: 'FK_correction_passes_panel_id' })
  panel?: JobPanel;

  @Column({ type: 'text' })
  step: string;

  @Column({ type: 'text' })
  machine: string;

  @Column({ type: 'text' })
  pad: string;

  @Column({ type: 'uuid', nullable: true })
  productId: string | null;

  @Column({ type: 'text', default: '' })
  speedSetting: string;

  @Column({ type: 'integer' })
  passes: number;

  @Column({ type: 'text' })
  result: string;

  @Column({ type: 'text', default: '' })
  note: string;

  @Column({ type: 'timestamptz' })
  loggedAt: Date;

  @Column({ type: 'uuid' })
  loggedBy: string;
}
