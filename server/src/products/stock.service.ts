import { Injectable } from '@nestjs/common';
import type { CommandContext } from '../commands/command.types';
import { Product } from './product.entity';
import { StockMovement } from './stock-movement.entity';

export type StockSource = 'pass' | 'solvent' | 'layer' | 'masking' | 'protection';

/**
 * Stock goes down when a product is logged in the field. One movement per (source record,
 * product), guarded by a unique key, so a retried or re-synced log never takes stock twice.
 */
@Injectable()
export class StockService {
  /** Records the use of `product.amountPerUse` of a product for one field record. */
  async recordUse(
    { actor, m }: CommandContext,
    use: { productId: string; jobId: string | null; sourceType: StockSource; sourceId: string },
  ): Promise<void> {
    const product = await m.findOne(Product, {
      where: { id: use.productId, businessId: actor.businessId },
    });
    if (!product || !(product.amountPerUse > 0)) return;
    const inserted = await m
      .createQueryBuilder()
      .insert()
      .into(StockMovement)
      .values({
        id: () => 'gen_random_uuid()',
        businessId: actor.businessId,
        productId: product.id,
        qty: -product.amountPerUse,
        reason: 'use',
        jobId: use.jobId,
        sourceType: use.sourceType,
        sourceId: use.sourceId,
        unitCostMinor: product.unitCostMinor,
      })
      .orIgnore()
      .execute();
    if (inserted.identifiers.length && inserted.raw && (inserted.raw as unknown[]).length) {
      await m
        .createQueryBuilder()
        .update(Product)
        .set({ stockQty: () => `stock_qty - ${Number(product.amountPerUse)}` })
        .where('id = :id', { id: product.id })
        .execute();
    }
  }
}
