import { PRODUCT_KINDS, type ProductKind, type ProductRow } from '@panelpass/shared';

/** Each kind in the detailer's words, one and many. */
export const KIND_WORDS: Record<ProductKind, { one: string; many: string }> = {
  compound: { one: 'Compound', many: 'Compounds' },
  polish: { one: 'Polish', many: 'Polishes' },
  'finishing-polish': { one: 'Finishing polish', many: 'Finishing polishes' },
  solvent: { one: 'Spot solvent', many: 'Spot solvents' },
  tape: { one: 'Masking tape', many: 'Masking tape' },
  'touch-up': { one: 'Touch-up paint', many: 'Touch-up paint' },
  protection: { one: 'Protection coating', many: 'Protection coatings' },
  cleaner: { one: 'Cleaner', many: 'Cleaners' },
  pad: { one: 'Pad', many: 'Pads' },
  tool: { one: 'Tool', many: 'Tools' },
  other: { one: 'Other', many: 'Other products' },
};

export function isProductKind(kind: string): kind is ProductKind {
  return (PRODUCT_KINDS as readonly string[]).includes(kind);
}

export function kindWords(kind: string): string {
  return isProductKind(kind) ? KIND_WORDS[kind].one : kind;
}

/**
 * Low on stock: at or below its own low-stock mark — the server's rule
 * (`stock_qty <= low_stock_at`, `GET /api/products?lowStock=true`). A product with no mark
 * (0) counts as low only when none is left.
 */
export function isLow(p: Pick<ProductRow, 'stockQty' | 'lowStockAt'>): boolean {
  return p.stockQty <= p.lowStockAt;
}

/** A number of the stock as people write it: no trailing zeros, at most 3 decimals. */
export function qtyText(n: number): string {
  return String(Math.round(n * 1000) / 1000);
}

/** "120 mL left", "None left". */
export function stockWords(p: Pick<ProductRow, 'stockQty' | 'unit'>): string {
  if (p.stockQty <= 0) return 'None left';
  return `${qtyText(p.stockQty)} ${p.unit} left`;
}

/** "Low: 40 mL left, reorder at 50 mL" — or null when the product is not low. */
export function lowWords(p: Pick<ProductRow, 'stockQty' | 'unit' | 'lowStockAt'>): string | null {
  if (!isLow(p)) return null;
  if (p.stockQty <= 0) return 'Out: none left';
  return `Low: reorder at ${qtyText(p.lowStockAt)} ${p.unit}`;
}

/** About how many more uses the stock covers (null when uses are not counted). */
export function usesLeft(p: Pick<ProductRow, 'stockQty' | 'amountPerUse'>): number | null {
  if (!(p.amountPerUse > 0)) return null;
  return Math.max(0, Math.floor((p.stockQty + 1e-9) / p.amountPerUse));
}

export interface KindGroup {
  kind: ProductKind | 'unknown';
  title: string;
  products: ProductRow[];
}

export interface ShelfView {
  /** Products at or below their mark, lowest first (by how far under the mark they are). */
  low: ProductRow[];
  /** Every product, by kind in the Shelf's order, by name within a kind. */
  groups: KindGroup[];
  total: number;
}

const byName = (a: ProductRow, b: ProductRow) =>
  a.name.localeCompare(b.name, undefined, { sensitivity: 'base' }) || a.id.localeCompare(b.id);

/** What the Shelf shows: the low-stock list first, then every product by kind. */
export function shelfView(products: readonly ProductRow[], query = ''): ShelfView {
  const words = query.trim().toLowerCase().split(/\s+/).filter(Boolean);
  const shown = products.filter((p) => {
    const text = `${p.name} ${kindWords(p.kind)}`.toLowerCase();
    return words.every((w) => text.includes(w));
  });
  const shortfall = (p: ProductRow) => (p.lowStockAt > 0 ? p.stockQty / p.lowStockAt : 0);
  const low = shown.filter(isLow).sort((a, b) => shortfall(a) - shortfall(b) || byName(a, b));
  const groups: KindGroup[] = [];
  for (const kind of PRODUCT_KINDS) {
    const inKind = shown.filter((p) => p.kind === kind).sort(byName);
    if (inKind.length) groups.push({ kind, title: KIND_WORDS[kind].many, products: inKind });
  }
  const unknown = shown.filter((p) => !isProductKind(p.kind)).sort(byName);
  if (unknown.length) groups.push({ kind: 'unknown', title: 'Other kinds', products: unknown });
  return { low, groups, total: shown.length };
}

/** Which usual cautions a product's kind calls for (the app's Cautions), if any. */
export type ProductCaution = 'solvent' | 'touch-up' | 'coating' | 'machine' | null;

export function cautionFor(kind: string): ProductCaution {
  switch (kind) {
    case 'solvent':
    case 'cleaner':
      return 'solvent';
    case 'touch-up':
      return 'touch-up';
    case 'protection':
      return 'coating';
    case 'compound':
    case 'polish':
    case 'finishing-polish':
      return 'machine';
    default:
      return null;
  }
}
