import { Column, Entity, Index, JoinColumn, ManyToOne } from 'typeorm';
import { SyncedEntity } from '../database/synced.entity';
import { Job } from '../jobs/job.entity';

/** A damage found at the walkaround, placed on the vehicle outline (x, y from 0 to 1). */
@Entity('damage_pins')
@Index('damage_pins_sync_idx', ['businessId', 'version'])
@Index('damage_pins_job_id_idx', ['jobId'])
export class DamagePin extends SyncedEntity {
  @Column({ type: 'uuid' })
  jobId: string;

  @ManyToOne(() => Job, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'job_id', foreignKeyConstraintName: 'FK_damage_pins_job_id' })
  job?: Job;

  @Column({ type: 'integer' })
  number: number;

  @Column({ type: 'double precision' })
  x: number;

  @Column({ type: 'double precision' })
  y: number;

  @Column({ type: 'text', nullable: true })
  panelKey: string | null;

  @Column({ type: 'text' })
  kind: string;

  @Column({ type: 'integer', default: 1 })
  severity: number;

  @Column({ type: 'text', default: '' })
  note: string;

  @Column({ type: 'uuid', nullable: true })
  photoId: string | null;
}
