import { Column, CreateDateColumn, Entity, Index, PrimaryColumn, UpdateDateColumn } from 'typeorm';
import { bigintNumber } from '../database/synced.entity';

/** One installed device of a user: how far the server has dealt with its mutations. */
@Entity('sync_clients')
@Index('sync_clients_user_idx', ['userId'])
export class SyncClient {
  @PrimaryColumn('uuid')
  clientId: string;

  @Column({ type: 'uuid' })
  businessId: string;

  @Column({ type: 'uuid' })
  userId: string;

  /** Highest mutation id applied or rejected; a pushed id at or below it is skipped. */
  @Column({ type: 'bigint', default: 0, transformer: bigintNumber })
  lastMutationId: number;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;
}
