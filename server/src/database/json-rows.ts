import type { DataSource, EntityMetadata, EntityTarget, ObjectLiteral } from 'typeorm';
import type { ColumnMetadata } from 'typeorm/metadata/ColumnMetadata';

/**
 * Records of several tables in one SQL statement: each row as a JSON array of its columns
 * (`json_build_array`), each list as `json_agg`, then made into the same entity objects a
 * TypeORM `find` makes — same class, same properties in the same order, same values.
 *
 * Why: on a busy server most of a read's cost is per query (a round trip through the kernel,
 * TypeORM building the SQL and hydrating the rows), not in the database; a job's workspace was
 * 19 queries. One statement is also one snapshot, without an explicit transaction.
 *
 * Values travel as JSON, so each column is written in SQL so that it comes back as TypeORM
 * would have had it from pg: timestamps as whole epoch milliseconds (pg's parser keeps
 * milliseconds, truncated), bigint and numeric as text (then the column's transformer, as
 * TypeORM does). `json-rows.e2e-spec.ts` checks every entity against TypeORM's own result.
 *
 * A read that only sends the rows on (the sync pull, the jobs list, a job) takes them as they go
 * on the wire instead (`sentRow`, `toSent`): plain objects whose JSON is the entity's JSON, with
 * each timestamp already the text `JSON.stringify` makes of a Date. Each Date in an answer costs a call to its
 * `toJSON` from inside `JSON.stringify`: a day's pull (270 rows, 760 timestamps) took 1.5 ms to
 * stringify with Dates and 0.4 ms with the same text, and PostgreSQL writes the text for about
 * 0.1 µs more a timestamp than the epoch number. Server CPU of that pull: 6.5–7.4 → 3.8 ms
 * (scripts/bench/api, API_BENCH_ONLY=pull-day).
 */
export class JsonRows<T extends ObjectLiteral> {
  private readonly columns: ColumnMetadata[];
  private readonly kinds: Kind[];
  readonly table: string;

  constructor(
    private readonly ds: DataSource,
    private readonly meta: EntityMetadata,
  ) {
    this.columns = meta.columns.filter((c) => !c.isVirtual);
    this.kinds = this.columns.map(kindOf);
    this.table = `"${meta.tableName}"`;
  }

  /** One row of alias `a` as a SQL expression: a JSON array of its columns. */
  row(a: string): string {
    const values = this.columns.map((c, i) => this.value(`${a}."${c.databaseName}"`, i));
    return `json_build_array(${values.join(', ')})`;
  }

  /** Column `i` (SQL `col`) as `row()` puts it in the JSON array. */
  private value(col: string, i: number): string {
    switch (this.kinds[i]) {
      case 'date':
        return `(extract(epoch from date_trunc('milliseconds', ${col})) * 1000)::int8`;
      case 'text':
        return `${col}::text`;
      default:
        return col;
    }
  }

  /**
   * One row of alias `a` as the API sends it: as `row()`, each timestamp the text a Date
   * gives in JSON (`2026-03-01T10:00:00.999Z`: UTC, milliseconds truncated as pg does). A year
   * outside 1–9999, which JavaScript writes with a sign and six digits, comes as epoch
   * milliseconds instead and is written by `toSent`.
   */
  sentRow(a: string): string {
    const values = this.columns.map((c, i) => {
      const col = `${a}."${c.databaseName}"`;
      if (this.kinds[i] !== 'date') return this.value(col, i);
      const ms = `date_trunc('milliseconds', ${col})`;
      return `CASE WHEN ${col} >= '0001-01-01T00:00:00Z' AND ${col} < '10000-01-01T00:00:00Z'
        THEN to_json(to_char(${ms} AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"'))
        ELSE to_json((extract(epoch from ${ms}) * 1000)::int8) END`;
    });
    return `json_build_array(${values.join(', ')})`;
  }

  /**
   * One row made by `sentRow()` as a plain object: the entity's properties in the entity's
   * order, whose JSON is the entity's JSON; `omit` leaves properties out.
   */
  toSent(values: unknown[], omit?: ReadonlySet<string>): Sent<T> {
    const out: Record<string, unknown> = {};
    for (let i = 0; i < this.columns.length; i++) {
      const column = this.columns[i]!;
      if (omit?.has(column.propertyName)) continue;
      const value = values[i];
      if (value === undefined) continue;
      if (this.kinds[i] === 'date') {
        out[column.propertyName] =
          typeof value === 'number' ? new Date(value).toISOString() : value;
      } else {
        out[column.propertyName] = this.hydrated(value, i);
      }
    }
    return out as Sent<T>;
  }

  /** The objects of a list of `sentRow()`s (null reads as none). */
  toSentAll(rows: unknown[][] | null | undefined): Sent<T>[] {
    return rows ? rows.map((r) => this.toSent(r)) : [];
  }

  /**
   * A scalar subquery: the rows of this table (alias `t`) matching `where`, in `order`, as one
   * JSON array (`[]` when none). `where` should name `t.deleted_at IS NULL` where a `find`
   * would have left tombstones out.
   */
  list(where: string, order?: string): string {
    const by = order ? ` ORDER BY ${order}` : '';
    return `(SELECT coalesce(json_agg(${this.row('t')}${by}), '[]'::json) FROM ${this.table} t WHERE ${where})`;
  }

  /** A scalar subquery: the first row matching `where` (alias `t`), or null. */
  one(where: string): string {
    return `(SELECT ${this.row('t')} FROM ${this.table} t WHERE ${where} LIMIT 1)`;
  }

  /** The entity of one row made by `row()`. */
  hydrate(values: unknown[]): T {
    const driver = this.ds.driver;
    const entity = this.meta.create(undefined, { fromDeserializer: true }) as T;
    for (let i = 0; i < this.columns.length; i++) {
      const value = values[i];
      if (value === undefined) continue;
      const column = this.columns[i]!;
      if (this.kinds[i] === 'date' && value !== null) {
        column.setEntityValue(
          entity,
          driver.prepareHydratedValue(new Date(value as number), column),
        );
      } else {
        column.setEntityValue(entity, this.hydrated(value, i));
      }
    }
    return entity;
  }

  /** A value of column `i` other than a timestamp as TypeORM has it (booleans, transformers…). */
  private hydrated(value: unknown, i: number): unknown {
    if (value !== null) {
      switch (this.kinds[i]) {
        case 'float':
          value = toFloat(value);
          break;
        case 'floats':
          value = (value as unknown[]).map((v) => (v === null ? null : toFloat(v)));
          break;
      }
    }
    return this.ds.driver.prepareHydratedValue(value, this.columns[i]!);
  }

  /** The entities of a list made by `list()` (null reads as none). */
  hydrateAll(rows: unknown[][] | null | undefined): T[] {
    return rows ? rows.map((r) => this.hydrate(r)) : [];
  }
}

/** An entity as it goes out in JSON (`toSent`): each timestamp as its ISO text. */
export type Sent<T> = {
  [K in keyof T]: T[K] extends Date ? string : T[K] extends Date | null ? string | null : T[K];
};

type Kind = 'date' | 'text' | 'float' | 'floats' | 'plain';

function kindOf(c: ColumnMetadata): Kind {
  const type = typeof c.type === 'string' ? c.type : '';
  if (c.isArray) {
    if (['double precision', 'float8', 'real', 'float4', 'float'].includes(type)) return 'floats';
    if (
      ![
        'text',
        'uuid',
        'varchar',
        'character varying',
        'integer',
        'int',
        'int4',
        'boolean',
      ].includes(type)
    ) {
      throw new Error(`JsonRows: array column ${c.databaseName} of type ${type} is not supported`);
    }
    return 'plain';
  }
  if (['timestamptz', 'timestamp with time zone', 'timestamp'].includes(type) || c.type === Date)
    return 'date';
  if (['bigint', 'int8', 'numeric', 'decimal'].includes(type)) return 'text';
  if (['double precision', 'float8', 'real', 'float4', 'float'].includes(type)) return 'float';
  if (
    [
      'text',
      'uuid',
      'varchar',
      'character varying',
      'integer',
      'int',
      'int4',
      'smallint',
      'boolean',
      'jsonb',
      'json',
    ].includes(type) ||
    c.type === String ||
    c.type === Boolean
  ) {
    return 'plain';
  }
  throw new Error(`JsonRows: column ${c.databaseName} of type ${String(type)} is not supported`);
}

/** JSON writes NaN and ±Infinity as strings; pg's parser gives numbers for them. */
const toFloat = (v: unknown): number => (typeof v === 'number' ? v : parseFloat(String(v)));

const cache = new WeakMap<DataSource, Map<unknown, JsonRows<ObjectLiteral>>>();

/** The (cached) JSON row reader of an entity on a data source. */
export function jsonRows<T extends ObjectLiteral>(
  ds: DataSource,
  entity: EntityTarget<T>,
): JsonRows<T> {
  let byEntity = cache.get(ds);
  if (!byEntity) cache.set(ds, (byEntity = new Map<unknown, JsonRows<ObjectLiteral>>()));
  let r = byEntity.get(entity);
  if (!r) byEntity.set(entity, (r = new JsonRows<ObjectLiteral>(ds, ds.getMetadata(entity))));
  return r as unknown as JsonRows<T>;
}
