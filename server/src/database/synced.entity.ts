import {
  Column,
  CreateDateColumn,
  DeleteDateColumn,
  JoinColumn,
  ManyToOne,
  PrimaryColumn,
  UpdateDateColumn,
  ValueTransformer,
} from 'typeorm';
import { Business } from '../businesses/business.entity';

/** bigint comes back from pg as a string; our versions stay far below 2^53. */
export const bigintNumber: ValueTransformer = {
  to: (v: number | undefined) => v,
  from: (v: string | null) => (v === null ? null : Number(v)),
};

/** numeric comes back as a string; amounts we keep as numeric are small decimals. */
export const numericNumber: ValueTransformer = {
  to: (v: number | null | undefined) => v,
  from: (v: string | null) => (v === null ? null : Number(v)),
};

/**
 * Columns of every record the app syncs. The id is made by the client (so a record can be
 * created offline). `version` comes from one sequence and is bumped by a trigger on every
 * insert and update (see the migration), so the pull cursor never misses a write.
 * `deletedAt` is a tombstone: rows are never removed while a device may still hold them.
 */
export abstract class SyncedEntity {
  @PrimaryColumn('uuid')
  id: string;

  @Column({ type: 'uuid' })
  businessId: string;

  @ManyToOne(() => Business, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'business_id' })
  business?: Business;

  @Column({ type: 'bigint', default: () => "nextval('sync_version')", transformer: bigintNumber })
  version: number;

  @CreateDateColumn({ type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz' })
  updatedAt: Date;

  @DeleteDateColumn({ type: 'timestamptz' })
  deletedAt: Date | null;
}

/**
 * A JSON object as stored in a jsonb column. Not recursive on purpose: TypeORM's partial-update
 * types cannot expand a recursive JSON type.
 */
export type JsonObject = { [key: string]: string | number | boolean | null | object };
