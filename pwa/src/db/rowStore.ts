import type { SyncRow, SyncRowTypes, SyncTable } from '@panelpass/shared';
import type { BaseEntry, LocalDb } from './localDb';

/**
 * What a command's local effect may do to the rows. The phone's Dexie copy implements it
 * (below), and so does the in-memory server of the tests: the same effect code runs on both.
 */
export interface RowStore {
  get<T extends SyncTable>(table: T, id: string): Promise<SyncRowTypes[T] | undefined>;
  /** Rows whose indexed field `index` equals `value` (the index must exist in the schema). */
  where<T extends SyncTable>(table: T, index: string, value: string): Promise<SyncRowTypes[T][]>;
  put<T extends SyncTable>(table: T, row: SyncRowTypes[T]): Promise<void>;
  /** Removes a row (the server keeps a tombstone; the phone drops it). */
  remove(table: SyncTable, id: string): Promise<void>;
}

export const baseKey = (table: SyncTable, id: string): string => `${table}/${id}`;

/**
 * The phone's rows, written optimistically. Before a pending mutation first changes a row,
 * the row as it was (the server's copy, or null when the server has none) is kept in `base`,
 * so a rebase can reset it and re-apply what is still pending. Use inside a Dexie
 * transaction over `db.writeScope`; one instance per transaction.
 */
export class OptimisticStore implements RowStore {
  private readonly kept = new Set<string>();

  constructor(private readonly db: LocalDb) {}

  get<T extends SyncTable>(table: T, id: string): Promise<SyncRowTypes[T] | undefined> {
    return this.db.rows(table).get(id);
  }

  where<T extends SyncTable>(table: T, index: string, value: string): Promise<SyncRowTypes[T][]> {
    return this.db.rows(table).where(index).equals(value).toArray();
  }

  async put<T extends SyncTable>(table: T, row: SyncRowTypes[T]): Promise<void> {
    await this.keepBase(table, row.id);
    await this.db.rows(table).put(row);
  }

  async remove(table: SyncTable, id: string): Promise<void> {
    await this.keepBase(table, id);
    await this.db.rows(table).delete(id);
  }

  private async keepBase(table: SyncTable, id: string): Promise<void> {
    const key = baseKey(table, id);
    if (this.kept.has(key)) return;
    this.kept.add(key);
    if (await this.db.base.get(key)) return;
    const current = (await this.db.rows(table).get(id)) as SyncRow | undefined;
    const entry: BaseEntry = { key, table, id, row: current ?? null };
    await this.db.base.put(entry);
  }
}
