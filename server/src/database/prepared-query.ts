import { createHash } from 'node:crypto';
import type { Pool } from 'pg';
import { DataSource, QueryFailedError } from 'typeorm';
import type { PostgresDriver } from 'typeorm/driver/postgres/PostgresDriver';

/**
 * A query run as a named prepared statement: each pooled connection parses and plans it once
 * and keeps that generic plan (plan_cache_mode, see data-source.ts). For the big one-statement
 * reads (a sync pull names every synced table; planning it afresh cost more than running it).
 * Errors come back as TypeORM's QueryFailedError, as from `DataSource.query`, so the exception
 * filter answers them the same way.
 */
export async function preparedQuery<T>(
  ds: DataSource,
  sql: string,
  values: unknown[],
): Promise<T[]> {
  let name = names.get(sql);
  if (!name) {
    name = `pp_${createHash('sha1').update(sql).digest('hex').slice(0, 20)}`;
    names.set(sql, name);
  }
  const pool = (ds.driver as PostgresDriver).master as Pool;
  try {
    const result = await pool.query<T & object>({ name, text: sql, values });
    return result.rows;
  } catch (e) {
    throw new QueryFailedError(sql, values, e as Error);
  }
}

const names = new Map<string, string>();
