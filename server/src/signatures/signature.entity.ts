import { Column, Entity, Index } from 'typeorm';
import { SyncedEntity, type JsonObject } from '../database/synced.entity';

/** A signature over exactly the record shown, with the SHA-256 of that record. Never edited. */
@Entity('signatures')
@Index('signatures_sync_idx', ['businessId', 'version'])
@Index('signatures_job_id_idx', ['jobId'])
@Index('signatures_quote_id_idx', ['quoteId'])
export class Signature extends SyncedEntity {
  @Column({ type: 'uuid', nullable: true })
  jobId: string | null;

  @Column({ type: 'uuid', nullable: true })
  quoteId: string | null;

  @Column({ type: 'text' })
  kind: string;

  @Column({ type: 'text' })
  signerName: string;

  @Column({ type: 'text' })
  imageSha256: string;

  @Column({ type: 'text' })
  recordHash: string;

  @Column({ type: 'jsonb' })
  record: JsonObject;

  @Column({ type: 'timestamptz' })
  signedAt: Date;
}
