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
import { DataSource, EntityManager, ObjectLiteral, SelectQueryBuilder } from 'typeorm';
import type { Actor } from '../auth/current-user.decorator';
import { CommandBus, lockBusinessWrites } from '../commands/command-bus.service';
import { toErrorBody } from '../common/all-exceptions.filter';
import { AppException, type ErrorBody } from '../common/app.exception';
import type { PullQueryDto, PushDto } from './dto/sync.dto';
import { SyncClient } from './sync-client.entity';
import { SyncRejection } from './sync-rejection.entity';

const DEFAULT_PULL_LIMIT = 1000;
/** Mutations per push transaction: one disk flush per chunk, and a short hold of the write lock. */
const PUSH_CHUNK = 50;

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
const HIDDEN_FROM_TECH: Partial<Record<SyncTable, string[]>> = {
  jobs: ['priceMinor'],
  products: ['unitCostMinor'],
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

@Injectable()
export class SyncService {
  private readonly logger = new Logger('Sync');

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly bus: CommandBus,
  ) {}

  /**
   * Applies the pushed mutations in order, exactly once. Mutations go in chunks of up to
   * PUSH_CHUNK per transaction, each mutation inside a savepoint of its own, and the device's
   * `lastMutationId` moves in the same transaction — so a retried push skips what was done,
   * and a crash loses nothing the device will not send again. (One transaction per mutation
   * would pay one disk flush per mutation; see docs/sync.md.) A mutation refused for good is
   * rolled back to its savepoint, recorded with its reason, and still advances the counter; a
   * passing failure (the database going away) aborts the chunk, and the device sends the rest
   * again later.
   */
  async push(actor: Actor, dto: PushDto): Promise<PushResponse> {
    this.checkRole(actor);
    const mutations = [...dto.mutations].sort((a, b) => a.id - b.id);
    const results: MutationOutcome[] = [];
    let lastMutationId = await this.ensureClient(actor, dto.clientId);
    for (let i = 0; i < mutations.length; i += PUSH_CHUNK) {
      const chunk = mutations.slice(i, i + PUSH_CHUNK);
      const done = await this.db.transaction(async (m) => {
        const client = await m.findOne(SyncClient, {
          where: { clientId: dto.clientId },
          lock: { mode: 'pessimistic_write' },
        });
        if (!client) throw new Error('sync client vanished');
        // Taken here, outside the savepoints: a lock taken inside one is let go when it rolls back.
        await lockBusinessWrites(m, actor.businessId);
        let last = client.lastMutationId;
        const outcomes: MutationOutcome[] = [];
        for (const mutation of chunk) {
          if (mutation.id <= last) {
            outcomes.push(await this.earlierOutcome(m, dto.clientId, mutation.id));
            continue;
          }
          outcomes.push(await this.applyOne(m, actor, dto.clientId, mutation));
          last = mutation.id;
        }
        if (last !== client.lastMutationId) {
          await m.update(SyncClient, { clientId: dto.clientId }, { lastMutationId: last });
        }
        return { outcomes, last };
      });
      results.push(...done.outcomes);
      lastMutationId = done.last;
    }
    return { lastMutationId, results, serverTime: Date.now() };
  }

  /**
   * A mutation dealt with before (a retried push): `skipped` if it was applied, or its
   * refusal again — so a device whose answer was lost still learns why.
   */
  private async earlierOutcome(
    m: EntityManager,
    clientId: string,
    id: number,
  ): Promise<MutationOutcome> {
    const refused = await m.findOne(SyncRejection, { where: { clientId, mutationId: id } });
    if (!refused) return { id, status: 'skipped' };
    return {
      id,
      status: 'rejected',
      code: refused.code,
      message: refused.message,
      ...(refused.details !== null ? { details: refused.details } : {}),
    };
  }

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
      const outcome: MutationOutcome = {
        id: mutation.id,
        status: 'rejected',
        code: body.code,
        message: body.message,
        ...(body.details !== undefined ? { details: body.details } : {}),
      };
      await m.insert(SyncRejection, {
        clientId,
        businessId: actor.businessId,
        mutationId: mutation.id,
        name: mutation.name,
        code: body.code,
        message: body.message,
        details: body.details ?? null,
      });
      return outcome;
    }
  }

  /** Every row the caller may see with `version > cursor`, tombstones included, a page at a time. */
  async pull(actor: Actor, query: PullQueryDto): Promise<PullResponse> {
    this.checkRole(actor);
    const limit = query.limit ?? DEFAULT_PULL_LIMIT;
    return this.db.transaction('REPEATABLE READ', async (m) => {
      // The caller's scope, the device's progress and which tables changed: one round trip.
      const start = await this.pullStart(m, actor, query, query.cursor);
      const { scope, lastMutationId } = start;
      const reset = query.cursor > 0 && query.scope !== scope;
      const cursor = reset ? 0 : query.cursor;
      const changed = reset ? (await this.pullStart(m, actor, query, 0)).changed : start.changed;

      const pages = new Map<SyncTable, SyncRow[]>();
      let truncatedAt = Number.POSITIVE_INFINITY;
      for (const table of SYNC_TABLES) {
        if (!changed.has(table)) continue;
        const qb = this.scoped(m, actor, table);
        if (!qb) continue;
        qb.andWhere('t.version > :cursor', { cursor });
        // Rows above a cut already made would be dropped below anyway: do not read them. (Same
        // page either way: a table cut short within the bound is cut at the same row.)
        if (Number.isFinite(truncatedAt)) qb.andWhere('t.version <= :cut', { cut: truncatedAt });
        const rows = await qb
          .orderBy('t.version', 'ASC')
          .take(limit + 1)
          .getMany();
        if (rows.length > limit) {
          rows.length = limit;
          truncatedAt = Math.min(truncatedAt, (rows[limit - 1] as { version: number }).version);
        }
        if (rows.length)
          pages.set(
            table,
            rows.map((r) => this.present(actor, table, r)),
          );
      }
      // When a table was cut short, keep only what lies at or below the cut in every table, so
      // the next page (from the new cursor) misses nothing.
      const more = Number.isFinite(truncatedAt);
      let newCursor = cursor;
      const changes: PullResponse['changes'] = {};
      for (const [table, rows] of pages) {
        const kept = more ? rows.filter((r) => r.version <= truncatedAt) : rows;
        if (!kept.length) continue;
        changes[table] = kept;
        newCursor = Math.max(newCursor, kept[kept.length - 1]!.version);
      }
      return {
        cursor: newCursor,
        lastMutationId,
        changes,
        more,
        serverTime: Date.now(),
        reset,
        scope,
      };
    });
  }

  /**
   * In one round trip: the caller's scope epoch, the device's last dealt-with mutation, and the
   * tables with any row of the business above the cursor (an index probe each) — a phone pulling
   * every few minutes finds changes in a few tables, not in all of them.
   */
  private async pullStart(
    m: EntityManager,
    actor: Actor,
    query: PullQueryDto,
    cursor: number,
  ): Promise<{ scope: number; lastMutationId: number; changed: Set<SyncTable> }> {
    const probes = SYNC_TABLES.map(
      (t, i) =>
        `SELECT ${i} AS i WHERE EXISTS (SELECT 1 FROM "${t}" WHERE business_id = $1 AND version > $2)`,
    );
    const [row] = await m.query<
      { scope: number | null; last_mutation_id: string | null; changed: number[] }[]
    >(
      `SELECT (SELECT scope_epoch FROM users WHERE id = $3) AS scope,
              (SELECT last_mutation_id FROM sync_clients WHERE client_id = $4 AND user_id = $3)
                AS last_mutation_id,
              ARRAY(${probes.join(' UNION ALL ')}) AS changed`,
      [actor.businessId, cursor, actor.userId, query.clientId],
    );
    return {
      scope: row?.scope ?? 0,
      lastMutationId: Number(row?.last_mutation_id ?? 0),
      changed: new Set((row?.changed ?? []).map((i) => SYNC_TABLES[i]!)),
    };
  }

  private scoped(
    m: EntityManager,
    actor: Actor,
    table: SyncTable,
  ): SelectQueryBuilder<ObjectLiteral> | null {
    const meta = this.db.entityMetadatas.find((e) => e.tableName === table);
    if (!meta) throw new Error(`No entity for synced table ${table}`);
    const qb = m
      .getRepository<ObjectLiteral>(meta.target)
      .createQueryBuilder('t')
      .withDeleted()
      .where('t.business_id = :b', { b: actor.businessId });
    if (actor.role === 'owner') return qb;
    if (OWNER_ONLY_TABLES.has(table)) return null;
    const assigned = 'SELECT j.id FROM jobs j WHERE j.business_id = :b AND j.assigned_tech_id = :u';
    qb.setParameter('u', actor.userId);
    if (table === 'jobs') return qb.andWhere('t.assigned_tech_id = :u');
    if (JOB_CHILD_TABLES.has(table)) return qb.andWhere(`t.job_id IN (${assigned})`);
    if (table === 'timers') return qb.andWhere(`(t.job_id IN (${assigned}) OR t.started_by = :u)`);
    if (table === 'climate_readings')
      return qb.andWhere(`(t.job_id IN (${assigned}) OR t.taken_by = :u)`);
    if (table === 'customers') {
      return qb.andWhere(
        `t.id IN (SELECT j.customer_id FROM jobs j WHERE j.business_id = :b AND j.assigned_tech_id = :u)`,
      );
    }
    if (table === 'vehicles') {
      return qb.andWhere(
        `t.id IN (SELECT j.vehicle_id FROM jobs j WHERE j.business_id = :b AND j.assigned_tech_id = :u)`,
      );
    }
    if (table === 'products') return qb;
    return null;
  }

  private present(actor: Actor, table: SyncTable, row: ObjectLiteral): SyncRow {
    const out: Record<string, unknown> = { ...row };
    if (actor.role === 'tech') for (const f of HIDDEN_FROM_TECH[table] ?? []) delete out[f];
    return out as SyncRow;
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
