import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';

/** An uploaded image (photo or signature) of a business, addressed by its SHA-256. */
@Entity('blobs')
export class StoredBlob {
  @PrimaryColumn({ type: 'uuid' })
  businessId: string;

  @PrimaryColumn({ type: 'text' })
  sha256: string;

  @Column({ type: 'text' })
  mime: string;

  @Column({ type: 'integer' })
  bytes: number;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;
}
