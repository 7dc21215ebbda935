import { describe, expect, it } from 'vitest';
import { childId } from '../jobs';
import { PRODUCT_KINDS } from './commands';
import {
  openingStockId,
  productCreateRows,
  stockAdjustRows,
  stockAfterUse,
  toStockQty,
} from './local-effects';

const ctx = { userId: 'u-1', businessId: 'b-1', atMs: Date.parse('2025-05-02T08:00:00.000Z') };
const productId = '6a2f0c1e-4b3d-4e5f-8a9b-0c1d2e3f4a5b';

describe('productCreateRows (the server’s product.create)', () => {
  it('records opening stock as a movement whose id is childId(product, opening-stock)', () => {
    const { product, opening } = productCreateRows(
      {
        id: productId,
        name: '  Cutting compound  ',
        kind: 'compound',
        properties: { cutLevel: 8, finishLevel: 3 },
        stockQty: 500,
        unitCostMinor: 3.5,
      },
      ctx,
    );
    expect(product).toMatchObject({
      id: productId,
      name: 'Cutting compound',
      unit: 'mL',
      stockQty: 500,
      amountPerUse: 0,
      lowStockAt: 0,
      sdsUrl: null,
      version: 0,
    });
    expect(openingStockId(productId)).toBe(childId(productId, 'opening-stock'));
    expect(opening).toMatchObject({
      id: childId(productId, 'opening-stock'),
      productId,
      qty: 500,
      reason: 'adjust',
      unitCostMinor: 3.5,
    });
  });

  it('makes no movement when nothing is in stock', () => {
    expect(productCreateRows({ id: productId, name: 'Pad', kind: 'pad' }, ctx).opening).toBeNull();
  });

  it('knows the same kinds as the server, in its order', () => {
    expect(PRODUCT_KINDS).toContain('touch-up');
    expect(PRODUCT_KINDS).toHaveLength(11);
  });
});

describe('stockAdjustRows (the server’s stock.adjust)', () => {
  const product = { stockQty: 20, unit: 'mL', unitCostMinor: 2 };
  const adjust = (qty: number, reason: 'restock' | 'adjust', unitCostMinor?: number) =>
    stockAdjustRows(
      {
        id: 'm-1',
        productId,
        qty,
        reason,
        ...(unitCostMinor === undefined ? {} : { unitCostMinor }),
      },
      product,
      ctx,
    );

  it('adds a delivery and takes its unit cost as the product’s', () => {
    const done = adjust(500, 'restock', 1.8);
    expect(done).toMatchObject({
      movement: { id: 'm-1', qty: 500, reason: 'restock', unitCostMinor: 1.8 },
      changes: { stockQty: 520, unitCostMinor: 1.8 },
    });
  });

  it('a correction keeps the unit cost and may take stock down to zero, not below', () => {
    expect(adjust(-20, 'adjust', 9)).toMatchObject({ changes: { stockQty: 0, unitCostMinor: 2 } });
    expect(adjust(-20.5, 'adjust')).toEqual({
      code: 'stock-below-zero',
      message: 'Only 20 mL in stock; this would take it below zero',
    });
  });

  it('refuses a restock that takes away, and a change of nothing', () => {
    expect(adjust(-1, 'restock')).toMatchObject({ code: 'validation-failed' });
    expect(adjust(0, 'adjust')).toMatchObject({ code: 'validation-failed' });
  });

  it('counts to 3 decimals like the server (no 0.1 + 0.2 drift)', () => {
    expect(
      stockAdjustRows(
        { id: 'm', productId, qty: 0.2, reason: 'adjust' },
        { ...product, stockQty: 0.1 },
        ctx,
      ),
    ).toMatchObject({
      changes: { stockQty: 0.3 },
    });
    expect(toStockQty(0.1 + 0.2)).toBe(0.3);
  });
});

describe('stockAfterUse', () => {
  it('takes the amount per use, and nothing when uses are not counted', () => {
    expect(stockAfterUse({ stockQty: 30, amountPerUse: 0.2 })).toBe(29.8);
    expect(stockAfterUse({ stockQty: 30, amountPerUse: 0 })).toBeNull();
  });
});
