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
    const values = this.columns.map((c, i) => {
      const col = `${a}."${c.databaseName}"`;
      switch (this.kinds[i]) {
        case 'date':
          return `(extract(epoch from date_trunc('milliseconds', ${col})) * 1000)::int8`;
        case 'text':
          return `${col}::text`;
        default:
          return col;
      }
    });
    return `json_build_array(${values.join(', ')})`;
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
      const column = this.columns[i]!;
      let value = values[i];
      if (value === undefined) continue;
      if (value !== null) {
        switch (this.kinds[i]) {
          case 'date':
            value = new Date(value as number);
            break;
          case 'float':
            value = toFloat(value);
            break;
          case 'floats':
            value = (value as unknown[]).map((v) => (v === null ? null : toFloat(v)));
            break;
        }
      }
      // Then as TypeORM does it (booleans, transformers…).
      column.setEntityValue(entity, driver.prepareHydratedValue(value, column));
    }
    return entity;
  }

  /** The entities of a list made by `list()` (null reads as none). */
  hydrateAll(rows: unknown[][] | null | undefined): T[] {
    return rows ? rows.map((r) => this.hydrate(r)) : [];
  }
}

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
