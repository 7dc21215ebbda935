import { describe, expect, it } from 'vitest';
import type { ProductRow } from '@panelpass/shared';
import { isLow, lowWords, shelfView, stockWords, usesLeft } from './shelf';

let n = 0;
function product(over: Partial<ProductRow>): ProductRow {
  n += 1;
  return {
    id: `p-${String(n).padStart(3, '0')}`,
    businessId: 'b',
    version: 1,
    createdAt: '2025-05-01T10:00:00.000Z',
    updatedAt: '2025-05-01T10:00:00.000Z',
    deletedAt: null,
    name: `Product ${n}`,
    kind: 'polish',
    properties: {},
    unit: 'mL',
    stockQty: 500,
    amountPerUse: 8,
    lowStockAt: 100,
    sdsUrl: null,
    ...over,
  };
}

describe('low stock (the server’s rule: stock at or below the product’s mark)', () => {
  it('is low at the mark and below it, not above', () => {
    expect(isLow({ stockQty: 100, lowStockAt: 100 })).toBe(true);
    expect(isLow({ stockQty: 99.5, lowStockAt: 100 })).toBe(true);
    expect(isLow({ stockQty: 100.001, lowStockAt: 100 })).toBe(false);
  });

  it('a product without a mark is low only when none is left', () => {
    expect(isLow({ stockQty: 3, lowStockAt: 0 })).toBe(false);
    expect(isLow({ stockQty: 0, lowStockAt: 0 })).toBe(true);
  });

  it('says it in words', () => {
    expect(lowWords({ stockQty: 40, lowStockAt: 50, unit: 'mL' })).toBe('Low: reorder at 50 mL');
    expect(lowWords({ stockQty: 0, lowStockAt: 50, unit: 'mL' })).toBe('Out: none left');
    expect(lowWords({ stockQty: 60, lowStockAt: 50, unit: 'mL' })).toBeNull();
    expect(stockWords({ stockQty: 29.8, unit: 'mL' })).toBe('29.8 mL left');
    expect(usesLeft({ stockQty: 30, amountPerUse: 0.2 })).toBe(150);
    expect(usesLeft({ stockQty: 30, amountPerUse: 0 })).toBeNull();
  });
});

describe('shelfView', () => {
  const nearlyOut = product({
    name: 'Glaze',
    kind: 'finishing-polish',
    stockQty: 10,
    lowStockAt: 100,
  });
  const atMark = product({ name: 'Compound', kind: 'compound', stockQty: 200, lowStockAt: 200 });
  const plenty = product({ name: 'Anti-hologram polish', kind: 'polish', stockQty: 900 });
  const pad = product({ name: 'Wool pad', kind: 'pad', unit: 'each', stockQty: 4, lowStockAt: 0 });
  const tar = product({ name: 'Tar remover', kind: 'solvent', stockQty: 480 });

  it('lists the low ones first, furthest under their mark first', () => {
    const view = shelfView([plenty, atMark, pad, nearlyOut, tar]);
    expect(view.low.map((p) => p.name)).toEqual(['Glaze', 'Compound']);
  });

  it('groups every product by kind in the Shelf’s order, by name within a kind', () => {
    const another = product({ name: 'a-step polish', kind: 'polish' });
    const view = shelfView([pad, plenty, tar, atMark, another, nearlyOut]);
    expect(view.groups.map((g) => [g.title, g.products.map((p) => p.name)])).toEqual([
      ['Compounds', ['Compound']],
      ['Polishes', ['a-step polish', 'Anti-hologram polish']],
      ['Finishing polishes', ['Glaze']],
      ['Spot solvents', ['Tar remover']],
      ['Pads', ['Wool pad']],
    ]);
    expect(view.total).toBe(6);
  });

  it('finds products by words of the name or kind', () => {
    expect(shelfView([plenty, tar, pad], 'solvent').groups.flatMap((g) => g.products)).toEqual([
      tar,
    ]);
    expect(shelfView([plenty, tar, pad], 'HOLOGRAM pol').total).toBe(1);
  });
});
