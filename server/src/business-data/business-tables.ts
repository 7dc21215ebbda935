import type { EntityManager } from 'typeorm';

/** A table that holds rows of a business, as the database describes it. */
export interface BusinessTable {
  name: string;
  /** `id` for `businesses` itself, `business_id` for every other. */
  key: 'id' | 'business_id';
  columns: { name: string; type: string }[];
  primaryKey: string[];
}

/**
 * Columns never exported: secrets and what stands for them (password hashes, hashes of link
 * and invite tokens, refresh-token secrets). Matched by name so a secret column added later is
 * left out too.
 */
export const SECRET_COLUMN = /(^|_)(password|secret|token)(_|$)/;

/**
 * Every table of the `public` schema with a `business_id` column, plus `businesses`: found in
 * the catalogue at each call, so a table added by a later migration is included without a
 * change here. Sorted by name.
 */
export async function businessTables(m: EntityManager): Promise<BusinessTable[]> {
  const cols = await m.query<{ table_name: string; column_name: string; data_type: string }[]>(
    `SELECT c.table_name, c.column_name, c.data_type
       FROM information_schema.columns c
       JOIN information_schema.tables t
         ON t.table_schema = c.table_schema AND t.table_name = c.table_name
      WHERE c.table_schema = 'public' AND t.table_type = 'BASE TABLE'
        AND (c.table_name = 'businesses' OR c.table_name IN (
              SELECT table_name FROM information_schema.columns
               WHERE table_schema = 'public' AND column_name = 'business_id'))
      ORDER BY c.table_name, c.ordinal_position`,
  );
  const keys = await m.query<{ table_name: string; column_name: string }[]>(
    `SELECT tc.table_name, kcu.column_name
       FROM information_schema.table_constraints tc
       JOIN information_schema.key_column_usage kcu
         ON kcu.constraint_schema = tc.constraint_schema AND kcu.constraint_name = tc.constraint_name
      WHERE tc.table_schema = 'public' AND tc.constraint_type = 'PRIMARY KEY'
      ORDER BY tc.table_name, kcu.ordinal_position`,
  );
  const tables = new Map<string, BusinessTable>();
  for (const c of cols) {
    const t = tables.get(c.table_name) ?? {
      name: c.table_name,
      key: c.table_name === 'businesses' ? ('id' as const) : ('business_id' as const),
      columns: [],
      primaryKey: [],
    };
    t.columns.push({ name: c.column_name, type: c.data_type });
    tables.set(c.table_name, t);
  }
  for (const k of keys) tables.get(k.table_name)?.primaryKey.push(k.column_name);
  return [...tables.values()].sort((a, b) => a.name.localeCompare(b.name));
}

/** Foreign keys between tables of `public`: `from` refers to `to`. */
export async function foreignKeys(m: EntityManager): Promise<{ from: string; to: string }[]> {
  return m.query<{ from: string; to: string }[]>(
    `SELECT DISTINCT c.conrelid::regclass::text AS "from", c.confrelid::regclass::text AS "to"
       FROM pg_constraint c JOIN pg_namespace n ON n.oid = c.connamespace
      WHERE c.contype = 'f' AND n.nspname = 'public'`,
  );
}

/**
 * An order to delete the tables' rows in that no foreign key can refuse: a table before every
 * table it refers to (children before parents). Keys of a table to itself are ignored; tables
 * in a cycle (none today) keep their name order at the end, where cascades must do the rest.
 */
export function deleteOrder(
  tables: readonly string[],
  keys: readonly { from: string; to: string }[],
): string[] {
  const left = new Set(tables);
  const order: string[] = [];
  const referredBy = (t: string) =>
    keys.some((k) => k.to === t && k.from !== t && left.has(k.from));
  for (;;) {
    const free = [...left].sort().filter((t) => !referredBy(t));
    if (!free.length) break;
    for (const t of free) {
      order.push(t);
      left.delete(t);
    }
  }
  return [...order, ...[...left].sort()];
}
