import { Column, Entity, Index } from 'typeorm';
import { numericNumber, SyncedEntity, type JsonObject } from '../database/synced.entity';

/** A product or tool on the Shelf, with the properties the computations need, stock and cost. */
@Entity('products')
@Index('products_sync_idx', ['businessId', 'version'])
export class Product extends SyncedEntity {
  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text' })
  kind: string;

  @Column({ type: 'jsonb', default: () => "'{}'" })
  properties: JsonObject;

  @Column({ type: 'text', default: 'mL' })
  unit: string;

  @Column({ type: 'numeric', precision: 12, scale: 3, default: 0, transformer: numericNumber })
  stockQty: number;

  @Column({ type: 'numeric', precision: 10, scale: 3, default: 0, transformer: numericNumber })
  amountPerUse: number;

  @Column({ type: 'numeric', precision: 12, scale: 4, default: 0, transformer: numericNumber })
  unitCostMinor: number;

  @Column({ type: 'numeric', precision: 12, scale: 3, default: 0, transformer: numericNumber })
  lowStockAt: number;

  @Column({ type: 'text', nullable: true })
  sdsUrl: string | null;
}
