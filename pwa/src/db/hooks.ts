import { useLiveQuery } from 'dexie-react-hooks';
import type { SyncRowTypes, SyncTable } from '@panelpass/shared';
import { useSyncActions } from '../sync/context';
import type { LocalDb } from './localDb';

/**
 * Live reads of the phone's database for screens. They answer `undefined` while loading (and
 * outside the signed-in shell), then re-render whenever the rows change — by this phone or by
 * a pull.
 */
export function useLocalDb(): LocalDb | null {
  // Not the status: a screen reading rows does not render again at each sync.
  return useSyncActions()?.db ?? null;
}

/** One row by id (undefined while loading, null when there is none). */
export function useRow<T extends SyncTable>(
  table: T,
  id: string | null | undefined,
): SyncRowTypes[T] | null | undefined {
  const db = useLocalDb();
  return useLiveQuery(
    async () => (db && id ? ((await db.rows(table).get(id)) ?? null) : null),
    [db, table, id],
  );
}

/** Every row of `table` whose indexed `field` equals `value`, optionally sorted by a field. */
export function useRowsWhere<T extends SyncTable>(
  table: T,
  field: string,
  value: string | null | undefined,
  sortBy?: keyof SyncRowTypes[T] & string,
): SyncRowTypes[T][] | undefined {
  const db = useLocalDb();
  return useLiveQuery(async () => {
    if (!db || !value) return [];
    const rows = await db.rows(table).where(field).equals(value).toArray();
    if (sortBy) rows.sort((a, b) => compare(a[sortBy], b[sortBy]));
    return rows;
  }, [db, table, field, value, sortBy]);
}

/** A job's rows of one table (panels, pins, readings…), in the given order. */
export function useJobRows<T extends SyncTable>(
  table: T,
  jobId: string | null | undefined,
  sortBy?: keyof SyncRowTypes[T] & string,
): SyncRowTypes[T][] | undefined {
  return useRowsWhere(table, 'jobId', jobId, sortBy);
}

function compare(a: unknown, b: unknown): number {
  if (typeof a === 'number' && typeof b === 'number') return a - b;
  const text = (v: unknown) => (typeof v === 'string' ? v : typeof v === 'number' ? String(v) : '');
  return text(a).localeCompare(text(b));
}
