import { useLiveQuery } from 'dexie-react-hooks';
import type { ProductRow, StockMovementRow } from '@panelpass/shared';
import { useLocalDb, useRow, useRowsWhere } from '../../../db/hooks';

/**
 * The Shelf as this phone holds it (live): the server's products with this phone's pending
 * changes on top — its own counts and deliveries, and the uses logged here and not yet sent
 * (each takes the product's amount per use at once, as the server will). Undefined while
 * loading.
 */
export function useProducts(): ProductRow[] | undefined {
  const db = useLocalDb();
  return useLiveQuery(async () => (db ? db.rows('products').toArray() : []), [db]);
}

export function useProduct(id: string | undefined): ProductRow | null | undefined {
  return useRow('products', id);
}

/** A product's stock movements, newest first (the owner's phone only: helpers get none). */
export function useStockMovements(productId: string | undefined): StockMovementRow[] | undefined {
  const rows = useRowsWhere('stock_movements', 'productId', productId, 'createdAt');
  return rows ? [...rows].reverse() : undefined;
}
