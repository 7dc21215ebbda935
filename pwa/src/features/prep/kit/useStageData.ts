import { useLiveQuery } from 'dexie-react-hooks';
import type { ClimateReadingRow, ProductRow } from '@panelpass/shared';
import { useLocalDb } from '../../../db/hooks';

/** Products on the Shelf of any of these kinds, by name (undefined while loading). */
export function useProductsOfKinds(kinds: readonly string[]): ProductRow[] | undefined {
  const db = useLocalDb();
  const key = kinds.join('|');
  return useLiveQuery(async () => {
    if (!db) return [];
    const rows = await db.rows('products').where('kind').anyOf(key.split('|')).toArray();
    return rows.sort((a, b) => a.name.localeCompare(b.name));
  }, [db, key]);
}

/** The temperature of a climate entry a panel is at: its surface reading, else the air's. */
export function panelTempC(reading: Pick<ClimateReadingRow, 'surfaceC' | 'airC'>): number {
  return reading.surfaceC ?? reading.airC;
}
