import { Column, Entity, Index, JoinColumn, ManyToOne, Unique } from 'typeorm';
import { numericNumber, SyncedEntity } from '../database/synced.entity';
import { Product } from './product.entity';

/** A change of stock: a use logged in the field (once per source record), a restock or an adjustment. */
@Entity('stock_movements')
@Index('stock_movements_sync_idx', ['businessId', 'version'])
@Index('stock_movements_product_id_idx', ['productId'])
@Index('stock_movements_job_id_idx', ['jobId'])
@Unique('stock_movements_source_type_source_id_product_id_key', [
  'sourceType',
  'sourceId',
  'productId',
])
export class StockMovement extends SyncedEntity {
  @Column({ type: 'uuid' })
  productId: string;

  @ManyToOne(() => Product, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'product_id', foreignKeyConstraintName: 'FK_stock_movements_product_id' })
  product?: Product;

  @Column({ type: 'numeric', precision: 12, scale: 3, transformer: numericNumber })
  qty: number;

  @Column({ type: 'text' })
  reason: string;

  @Column({ type: 'uuid', nullable: true })
  jobId: string | null;

  @Column({ type: 'text', nullable: true })
  sourceType: string | null;

  @Column({ type: 'uuid', nullable: true })
  sourceId: string | null;

  @Column({ type: 'numeric', precision: 12, scale: 4, default: 0, transformer: numericNumber })
  unitCostMinor: number;
}
