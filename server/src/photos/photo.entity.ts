import { Column, Entity, Index } from 'typeorm';
import { SyncedEntity } from '../database/synced.entity';

/** A photo's record; the image itself is a blob stored by its SHA-256. */
@Entity('photos')
@Index('photos_sync_idx', ['businessId', 'version'])
@Index('photos_job_id_idx', ['jobId'])
@Index('photos_vehicle_id_idx', ['vehicleId'])
export class Photo extends SyncedEntity {
  @Column({ type: 'uuid', nullable: true })
  jobId: string | null;

  @Column({ type: 'uuid', nullable: true })
  vehicleId: string | null;

  @Column({ type: 'text', nullable: true })
  subjectType: string | null;

  @Column({ type: 'uuid', nullable: true })
  subjectId: string | null;

  @Column({ type: 'text' })
  kind: string;

  @Column({ type: 'text' })
  sha256: string;

  @Column({ type: 'text' })
  mime: string;

  @Column({ type: 'integer', default: 0 })
  width: number;

  @Column({ type: 'integer', default: 0 })
  height: number;

  @Column({ type: 'integer', default: 0 })
  bytes: number;

  @Column({ type: 'text', default: '' })
  caption: string;

  @Column({ type: 'timestamptz' })
  takenAt: Date;
}
