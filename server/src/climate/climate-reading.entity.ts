import { Column, Entity, Index, JoinColumn, ManyToOne } from 'typeorm';
import { numericNumber, SyncedEntity } from '../database/synced.entity';
import { Job } from '../jobs/job.entity';

/** Air temperature, humidity and surface temperature entered on site (append-only). */
@Entity('climate_readings')
@Index('climate_readings_sync_idx', ['businessId', 'version'])
@Index('climate_readings_job_id_idx', ['jobId'])
export class ClimateReading extends SyncedEntity {
  @Column({ type: 'uuid', nullable: true })
  jobId: string | null;

  @ManyToOne(() => Job, { onDelete: 'SET NULL' })
  @JoinColumn({ name: 'job_id', foreignKeyConstraintName: 'FK_climate_readings_job_id' })
  job?: Job;

  @Column({ type: 'numeric', precision: 5, scale: 1, transformer: numericNumber })
  airC: number;

  @Column({ type: 'numeric', precision: 4, scale: 1, transformer: numericNumber })
  rhPct: number;

  @Column({ type: 'numeric', precision: 5, scale: 1, nullable: true, transformer: numericNumber })
  surfaceC: number | null;

  @Column({ type: 'timestamptz' })
  takenAt: Date;

  @Column({ type: 'uuid' })
  takenBy: string;
}
