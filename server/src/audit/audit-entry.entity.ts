import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import type { JsonObject } from '../database/synced.entity';

/** Who changed what: one row per command applied, written in the command's transaction. */
@Entity('audit_entries')
@Index('audit_entries_business_at_idx', ['businessId', 'at'])
export class AuditEntry {
  /** bigint, as a string. */
  @PrimaryGeneratedColumn({ type: 'bigint' })
  id: string;

  @Column({ type: 'uuid' })
  businessId: string;

  @Column({ type: 'uuid', nullable: true })
  userId: string | null;

  /** The command's name, e.g. `job.setStage`. */
  @Column({ type: 'text' })
  command: string;

  @Column({ type: 'uuid', nullable: true })
  subjectId: string | null;

  @Column({ type: 'jsonb', default: () => "'{}'" })
  args: JsonObject;

  /** `rest` or the sync client's id. */
  @Column({ type: 'text', default: 'rest' })
  via: string;

  @CreateDateColumn({ type: 'timestamptz' })
  at: Date;
}
