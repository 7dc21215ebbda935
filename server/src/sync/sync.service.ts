import { HttpStatus, Injectable, Logger } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import {
  SYNC_TABLES,
  type MutationOutcome,
  type PullResponse,
  type PushResponse,
  type SyncRow,
  type SyncTable,
} from '@panelpass/shared';
import { DataSource, EntityManager, type EntityTarget, In, type ObjectLiteral } from 'typeorm';
import { jsonRows } from '../database/json-rows';
import { preparedQuery } from '../database/prepared-query';
import type { Actor } from '../auth/current-user.decorator';
import { CallOutInRerunnableRun, markRerunnable } from '../commands/call-out';
import {
  type AuditRow,
  CommandBus,
  lockBusinessWrites,
  writeAudit,
} from '../commands/command-bus.service';
import { toErrorBody } from '../common/all-exceptions.filter';
import { AppException, type ErrorBody } from '../common/app.exception';
import type { PullQueryDto, PushDto } from './dto/sync.dto';
import { SyncClient } from './sync-client.entity';
import { SyncRejection } from './sync-rejection.entity';

const DEFAULT_PULL_LIMIT = 1000;

/** The pull's one row: see `SyncService.pullSql`; `tN` the rows of the N-th table read. */
interface PullRow {
  scope: number | null;
  last_mutation_id: string | null;
  cut: string | null;
  [table: `t${number}`]: unknown[][] | null;
}
/**
 * Mutations per push transaction: one disk flush per chunk, and a short hold of the business's
 * write lock — a chunk also closes once it has taken PUSH_CHUNK_MS (after the mutation in hand),
 * so heavy commands do not hold the lock long.
 */
const PUSH_CHUNK = 100;
const PUSH_CHUNK_MS = 250;

/** Tables a helper sees through the jobs assigned to them (by `job_id`). */
const JOB_CHILD_TABLES = new Set<SyncTable>([
  'job_panels',
  'checklist_items',
  'damage_pins',
  'film_readings',
  'correction_passes',
  'chips',
  'chip_layers',
  'solvent_applications',
  'masking_items',
  'photos',
  'signatures',
]);
/** Money tables: never sent to a helper. */
const OWNER_ONLY_TABLES = new Set<SyncTable>([
  'quotes',
  'quote_lines',
  'payments',
  'invoices',
  'stock_movements',
]);
/** Fields a helper's device never receives. */
const HIDDEN_FROM_TECH: Partial<Record<SyncTable, ReadonlySet<string>>> = {
  jobs: new Set(['priceMinor']),
  products: new Set(['unitCostMinor']),
};

/**
 * A failure that will not go away on retry (bad arguments, no permission, a refused state
 * change): the mutation is refused and the queue moves on. Anything else (the database going
 * away) aborts the push so the device sends it again.
 */
function permanentFailure(e: unknown): ErrorBody | null {
  const body = toErrorBody(e);
  return body.statusCode >= 400 && body.statusCode < 500 && body.statusCode !== 429 ? body : null;
}

/** Thrown out of an optimistic chunk's transaction: roll it back, run the chunk carefully. */
class RunCarefully extends Error {}

/** A refusal as the device is told it (also when told again: a retried push). */
function refusal(
  id: number,
  r: Pick<SyncRejection, 'code' | 'message'> & { details?: unknown },
): MutationOutcome {
  return {
    id,
    status: 'rejected',
    code: r.code,
    message: r.message,
    ...(r.details !== null && r.details !== undefined ? { details: r.details } : {}),
  };
}

interface ChunkDone {
  outcomes: MutationOutcome[];
  last: number;
}

@Injectable()
export class SyncService {
  private readonly logger = new Logger('Sync');

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
  ) {}

  /**
   * Applies the pushed mutations in order, exactly once. Mutations go in chunks, one
   * transaction each (up to PUSH_CHUNK mutations, closed early once it has taken
   * PUSH_CHUNK_MS), and the device's `lastMutationId` moves in the same transaction — so a
   * retried push skips what was done, and a crash loses nothing the device will not send
   * again. (One transaction per mutation would pay one disk flush per mutation; see
   * docs/sync.md.)
   *
   * A chunk is first run straight through, its audit entries written together at its end
   * (optimistic). If any mutation in it is refused for good, that whole transaction is rolled
   * back and the chunk is run again carefully: each mutation inside a savepoint of its own, so
   * a refused one is rolled back alone, recorded with its reason, and still advances the
   * counter. Refusals are rare, so most chunks pay no savepoints. A passing failure (the
   * database going away) aborts the chunk either way, and the device sends the rest again.
   */
  async push(actor: Actor, dto: PushDto): Promise<PushResponse> {
    this.checkRole(actor);
    const mutations = [...dto.mutations].sort((a, b) => a.id - b.id);
    const results: MutationOutcome[] = [];
    let lastMutationId = await this.ensureClient(actor, dto.clientId);
    let i = 0;
    while (i < mutations.length) {
      const chunk = mutations.slice(i, i + PUSH_CHUNK);
      let done: ChunkDone;
      try {
        done = await this.db.transaction((m) => this.runChunk(m, actor, dto.clientId, chunk, true));
      } catch (e) {
        if (!(e instanceof RunCarefully)) throw e;
        done = await this.db.transaction((m) =>
          this.runChunk(m, actor, dto.clientId, chunk, false),
        );
      }
      results.push(...done.outcomes);
      lastMutationId = done.last;
      i += done.outcomes.length;
    }
    return { lastMutationId, results, serverTime: Date.now() };
  }

  /**
   * One chunk in one transaction, from its first mutation until the chunk ends or its time is
   * up; answers an outcome for each mutation dealt with. Optimistic (`straight`): no
   * savepoints, audit entries written in one statement at the end, and the first refusal throws
   * `RunCarefully`, which rolls back everything the chunk did. A command that reaches outside
   * the database (`reachesOutside`: the card provider) must not run in a transaction that may
   * be rolled back and run again, so at the first such command the rest of the chunk goes
   * carefully, in the same transaction. Careful: a savepoint per mutation.
   */
  private async runChunk(
    m: EntityManager,
    actor: Actor,
    clientId: string,
    chunk: PushDto['mutations'],
    straight: boolean,
  ): Promise<ChunkDone> {
    const started = Date.now();
    const run = straight ? markRerunnable(m) : null;
    const client = await m.findOne(SyncClient, {
      where: { clientId },
      lock: { mode: 'pessimistic_write' },
    });
    if (!client) throw new Error('sync client vanished');
    // Taken here, outside the savepoints: a lock taken inside one is let go when it rolls back.
    await lockBusinessWrites(m, actor.businessId);
    let last = client.lastMutationId;
    // A mutation dealt with before is `skipped` if it was applied, else refused again.
    const refused = await this.earlierRefusals(m, clientId, chunk, last);
    const outcomes: MutationOutcome[] = [];
    const audit: AuditRow[] = [];
    for (const mutation of chunk) {
      if (mutation.id <= last) {
        outcomes.push(refused.get(mutation.id) ?? { id: mutation.id, status: 'skipped' });
      } else {
        if (run?.active && this.bus.reachesOutside(mutation.name)) {
          await this.writeChunkAudit(m, audit.splice(0));
          run.active = false;
        }
        if (run?.active) {
          try {
            await this.bus.executeIn(m, actor, mutation.name, mutation.args, clientId, audit);
          } catch (e) {
            // `calledOut` too: the command may have wrapped the throw in an error of its own.
            if (run.calledOut || e instanceof CallOutInRerunnableRun || permanentFailure(e)) {
              throw new RunCarefully();
            }
            throw e;
          }
          if (run.calledOut) throw new RunCarefully();
          outcomes.push({ id: mutation.id, status: 'applied' });
        } else {
          const outcome = await this.applyOne(m, actor, clientId, mutation);
          if (outcome.status === 'rejected') refused.set(mutation.id, outcome);
          outcomes.push(outcome);
        }
        last = mutation.id;
      }
      if (Date.now() - started >= PUSH_CHUNK_MS) break;
    }
    await this.writeChunkAudit(m, audit);
    if (last !== client.lastMutationId) {
      await m.update(SyncClient, { clientId }, { lastMutationId: last });
    }
    return { outcomes, last };
  }

  /**
   * The optimistic run's audit entries. Refused for good (an entry PostgreSQL will not take),
   * the chunk goes again carefully, where each mutation writes its own and only the one at
   * fault is refused.
   */
  private async writeChunkAudit(m: EntityManager, rows: AuditRow[]): Promise<void> {
    try {
      await writeAudit(m, rows);
    } catch (e) {
      if (permanentFailure(e)) throw new RunCarefully();
      throw e;
    }
  }

  /**
   * The recorded refusals among the chunk's mutations dealt with before (a retried push), in
   * one query: their outcome is the refusal again, so a device whose answer was lost still
   * learns why; the others were applied.
   */
  private async earlierRefusals(
    m: EntityManager,
    clientId: string,
    chunk: PushDto['mutations'],
    last: number,
  ): Promise<Map<number, MutationOutcome>> {
    const ids = chunk.filter((x) => x.id <= last).map((x) => x.id);
    if (!ids.length) return new Map();
    const rows = await m.find(SyncRejection, { where: { clientId, mutationId: In(ids) } });
    return new Map(rows.map((r) => [r.mutationId, refusal(r.mutationId, r)]));
  }

  /** One mutation in a savepoint of its own (the careful run); a refusal is recorded. */
  private async applyOne(
    m: EntityManager,
    actor: Actor,
    clientId: string,
    mutation: PushDto['mutations'][number],
  ): Promise<MutationOutcome> {
    try {
      // A savepoint: a refused mutation rolls back its own writes, nothing else.
      await m.transaction((inner) =>
        this.bus.executeIn(inner, actor, mutation.name, mutation.args, clientId),
      );
      return { id: mutation.id, status: 'applied' };
    } catch (e) {
      const body = permanentFailure(e);
      if (!body) throw e;
      await m.insert(SyncRejection, {
        clientId,
        businessId: actor.businessId,
        mutationId: mutation.id,
        name: mutation.name,
        code: body.code,
        message: body.message,
        details: body.details ?? null,
      });
      return refusal(mutation.id, body);
    }
  }

  /**
   * Every row the caller may see with `version > cursor`, tombstones included, a page at a
   * time — read in one SQL statement (one snapshot, so no transaction), see `pullSql`.
   */
  async pull(actor: Actor, query: PullQueryDto): Promise<PullResponse> {
    this.checkRole(actor);
    const limit = query.limit ?? DEFAULT_PULL_LIMIT;
    const tables = SYNC_TABLES.filter((t) => this.scopeSql(actor, t) !== null);
    const [row] = await preparedQuery<PullRow>(this.db, this.pullSql(actor, tables), [
      actor.businessId,
      query.cursor,
      actor.userId,
      query.clientId,
      query.scope,
      limit,
    ]);
    if (!row) throw new Error('pull: no answer');
    const scope = row.scope ?? 0;
    const reset = query.cursor > 0 && query.scope !== scope;
    const cursor = reset ? 0 : query.cursor;
    // Where a table was cut short by the page limit (the lowest such cut): keep only what lies
    // at or below it in every table, so the next page (from the new cursor) misses nothing.
    const more = row.cut !== null;
    const truncatedAt = more ? Number(row.cut) : Number.POSITIVE_INFINITY;
    let newCursor = cursor;
    const changes: PullResponse['changes'] = {};
    tables.forEach((table, i) => {
      const raw = row[`t${i}`];
      if (!raw?.length) return;
      const reader = jsonRows<ObjectLiteral>(this.db, this.entityOf(table));
      const hidden = actor.role === 'tech' ? HIDDEN_FROM_TECH[table] : undefined;
      const rows: SyncRow[] = [];
      for (const values of raw.slice(0, limit)) {
        const r = reader.toSent(values, hidden) as SyncRow & { version: number };
        if (r.version <= truncatedAt) rows.push(r);
      }
      if (!rows.length) return;
      changes[table] = rows;
      newCursor = Math.max(newCursor, rows[rows.length - 1]!.version);
    });
    return {
      cursor: newCursor,
      lastMutationId: Number(row.last_mutation_id ?? 0),
      changes,
      more,
      serverTime: Date.now(),
      reset,
      scope,
    };
  }

  /**
   * The pull in one statement. $1 business, $2 cursor, $3 user, $4 device, $5 the scope the
   * device holds, $6 rows per table. `s`: the caller's scope epoch and the device's last
   * dealt-with mutation; `c`: the cursor (0 when the scope changed: the device starts over).
   * Then per table, in SYNC_TABLES order, `pN` reads up to limit + 1 rows above the cursor
   * through its (business_id, version) index — no more than the cut already made by an
   * earlier table, since rows above it would be dropped anyway (the page is the same) — and
   * `kN` carries the cut: the version of the limit-th row of a table that had more.
   */
  private pullSql(actor: Actor, tables: SyncTable[]): string {
    const key = tables.join(',') + actor.role;
    const cached = this.pullSqlCache.get(key);
    if (cached) return cached;
    const none = '9223372036854775807::bigint';
    const ctes = [
      `s AS (SELECT (SELECT scope_epoch FROM users WHERE id = $3) AS scope,
        (SELECT last_mutation_id FROM sync_clients WHERE client_id = $4 AND user_id = $3)
          AS last_mutation_id)`,
      `c AS (SELECT CASE WHEN $2::bigint > 0 AND coalesce(s.scope, 0) <> $5::int THEN 0::bigint
        ELSE $2::bigint END AS cursor FROM s)`,
    ];
    tables.forEach((table, i) => {
      const reader = jsonRows<ObjectLiteral>(this.db, this.entityOf(table));
      const prev = i === 0 ? none : `(SELECT cut FROM k${i - 1})`;
      ctes.push(
        `p${i} AS MATERIALIZED (SELECT t.version, ${reader.sentRow('t')} AS r FROM "${table}" t
          WHERE t.business_id = $1 AND ${this.scopeSql(actor, table)}
            AND t.version > (SELECT cursor FROM c) AND t.version <= ${prev}
          ORDER BY t.version LIMIT $6::int + 1)`,
        `k${i} AS (SELECT CASE WHEN (SELECT count(*) FROM p${i}) > $6::int
          THEN LEAST(${prev}, (SELECT version FROM p${i} ORDER BY version OFFSET $6::int - 1 LIMIT 1))
          ELSE ${prev} END AS cut)`,
      );
    });
    const last = tables.length ? `(SELECT cut FROM k${tables.length - 1})` : none;
    const sql = `WITH ${ctes.join(',\n')}
      SELECT s.scope, s.last_mutation_id, NULLIF(${last}, ${none}) AS cut,
        ${tables.map((_, i) => `(SELECT json_agg(r ORDER BY version) FROM p${i}) AS t${i}`).join(',\n')}
      FROM s`;
    this.pullSqlCache.set(key, sql);
    return sql;
  }

  private readonly pullSqlCache = new Map<string, string>();

  private entityOf(table: SyncTable): EntityTarget<ObjectLiteral> {
    const meta = this.db.entityMetadatas.find((e) => e.tableName === table);
    if (!meta) throw new Error(`No entity for synced table ${table}`);
    return meta.target;
  }

  /**
   * Which rows of `table` (alias `t`, already of the business $1) the caller ($3) may see, as
   * SQL; null when none. The owner sees everything; a helper the jobs assigned to them and
   * what hangs off those, their own timers and climate readings, and the Shelf — never money.
   */
  private scopeSql(actor: Actor, table: SyncTable): string | null {
    if (actor.role === 'owner') return 'true';
    if (OWNER_ONLY_TABLES.has(table)) return null;
    const assigned = 'SELECT j.id FROM jobs j WHERE j.business_id = $1 AND j.assigned_tech_id = $3';
    if (table === 'jobs') return 't.assigned_tech_id = $3';
    if (JOB_CHILD_TABLES.has(table)) return `t.job_id IN (${assigned})`;
    if (table === 'timers') return `(t.job_id IN (${assigned}) OR t.started_by = $3)`;
    if (table === 'climate_readings') return `(t.job_id IN (${assigned}) OR t.taken_by = $3)`;
    if (table === 'customers') {
      return `t.id IN (SELECT j.customer_id FROM jobs j WHERE j.business_id = $1 AND j.assigned_tech_id = $3)`;
    }
    if (table === 'vehicles') {
      return `t.id IN (SELECT j.vehicle_id FROM jobs j WHERE j.business_id = $1 AND j.assigned_tech_id = $3)`;
    }
    if (table === 'products') return 'true';
    return null;
  }

  private checkRole(actor: Actor): void {
    if (actor.role === 'customer') {
      throw new AppException(HttpStatus.FORBIDDEN, 'forbidden', 'Customers do not sync devices');
    }
  }

  /** Registers a device on its first push; a device id belongs to one person. */
  private async ensureClient(actor: Actor, clientId: string): Promise<number> {
    await this.db
      .createQueryBuilder()
      .insert()
      .into(SyncClient)
      .values({ clientId, businessId: actor.businessId, userId: actor.userId, lastMutationId: 0 })
      .orIgnore()
      .execute();
    const client = await this.db.getRepository(SyncClient).findOneByOrFail({ clientId });
    if (client.userId !== actor.userId) {
      this.logger.warn(`device ${clientId} pushed by another user`);
      throw new AppException(
        HttpStatus.CONFLICT,
        'client-id-taken',
        'This device id belongs to another sign-in; start a fresh one',
      );
    }
    return client.lastMutationId;
  }
}
