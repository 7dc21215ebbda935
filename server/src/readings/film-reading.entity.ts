import { Column, Entity, Index, JoinColumn, ManyToOne } from 'typeorm';
import { SyncedEntity } from '../database/synced.entity';
import { Job } from '../jobs/job.entity';
import { JobPanel } from '../panels/job-panel.entity';

/** One spot on a panel: several gauge readings (stored in µm; `unit` is how they were entered). */
@Entity('film_readings')
@Index('film_readings_sync_idx', ['businessId', 'version'])
@Index('film_readings_job_id_idx', ['jobId'])
@Index('film_readings_panel_id_idx', ['panelId'])
export class FilmReading extends SyncedEntity {
  @Column({ type: 'uuid' })
  jobId: string;

  @ManyToOne(() => Job, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'job_id', foreignKeyConstraintName: 'FK_film_readings_job_id' })
  job?: Job;

  @Column({ type: 'uuid' })
  panelId: string;

  @ManyToOne(() => JobPanel, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'panel_id', foreignKeyConstraintName: 'FK_film_readings_panel_id' })
  panel?: JobPanel;

  @Column({ type: 'text', default: 'before' })
  phase: string;

  @Column({ type: 'double precision', array: true })
  readingsUm: number[];

  @Column({ type: 'text', default: 'um' })
  unit: string;

  @Column({ type: 'text' })
  gaugeType: string;

  @Column({ type: 'timestamptz' })
  takenAt: Date;

  @Column({ type: 'uuid' })
  takenBy: string;
}
