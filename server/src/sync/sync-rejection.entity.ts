import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import { bigintNumber } from '../database/synced.entity';

/** A pushed mutation the server refused for good (validation, permission), with its reason. */
@Entity('sync_rejections')
@Index('sync_rejections_client_idx', ['clientId', 'mutationId'], { unique: true })
export class SyncRejection {
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id: string;

  @Column({ type: 'uuid' })
  clientId: string;

  @Column({ type: 'uuid' })
  businessId: string;

  @Column({ type: 'bigint', transformer: bigintNumber })
  mutationId: number;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text' })
  code: string;

  @Column({ type: 'text' })
  message: string;

  @Column({ type: 'jsonb', nullable: true })
  details: object | null;

  @CreateDateColumn({ type: 'timestamptz' })
  at: Date;
}
