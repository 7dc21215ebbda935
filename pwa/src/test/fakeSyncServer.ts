import {
  blobsReferenced,
  SYNC_TABLES,
  type Mutation,
  type MutationOutcome,
  type PullQuery,
  type PullResponse,
  type PushRequest,
  type PushResponse,
  type SyncRow,
  type SyncRowTypes,
  type SyncTable,
} from '@panelpass/shared';
import { commandDef } from '../db/commands';
import { CommandRefusedError } from '../db/errors';
import { sha256Hex } from '../db/images';
import type { DbOwner } from '../db/localDb';
import type { RowStore } from '../db/rowStore';
import { json } from './sessions';

type Fault = 'down' | 'lost-answer' | 'database-down';
type Route = 'push' | 'pull' | 'blob';

/**
 * A stand-in for the server's sync endpoints, in memory, as a `fetch`: it applies pushed
 * mutations once each and in order (through the same command effects the phone uses), keeps
 * each client's lastMutationId, bumps one version sequence on every write, keeps tombstones,
 * and answers pulls by version cursor in pages. Faults can be queued per route: `down`
 * (no answer, nothing done), `lost-answer` (done and committed, then the answer is lost) and
 * `database-down` (the server's 503 while its database is away, nothing done).
 */
export class FakeSyncServer {
  readonly tables = new Map<SyncTable, Map<string, SyncRow>>(
    SYNC_TABLES.map((t) => [t, new Map()]),
  );
  readonly blobs = new Map<string, { mime: string; size: number }>();
  /** Every mutation applied, in order, as `clientId:id name`. */
  readonly applied: string[] = [];
  /** Every call, in order, as `PUT blob <sha>` / `push 1,2,3` / `pull <cursor>`. */
  readonly calls: string[] = [];
  private readonly clients = new Map<string, number>();
  private version = 0;
  private readonly faults: Record<Route, Fault[]> = { push: [], pull: [], blob: [] };
  pageSize = 500;
  /** The `limit` each pull asked for (null: none), in order. */
  readonly pullLimits: (number | null)[] = [];
  now = () => Date.parse('2025-05-02T08:00:00.000Z');
  /** Refuse some mutations the way the real server would (a rule the phone does not know). */
  refuse: (m: Mutation) => { code: string; message: string } | null = () => null;

  constructor(readonly actor: DbOwner) {}

  failNext(route: Route, fault: Fault, times = 1): void {
    for (let i = 0; i < times; i++) this.faults[route].push(fault);
  }

  lastMutationId(clientId: string): number {
    return this.clients.get(clientId) ?? 0;
  }

  /** Rows as the other phone or the office left them (bumps the version like any write). */
  seed<T extends SyncTable>(table: T, row: SyncRowTypes[T]): void {
    this.write(table, row);
  }

  row<T extends SyncTable>(table: T, id: string): SyncRowTypes[T] | undefined {
    return this.tables.get(table)!.get(id) as SyncRowTypes[T] | undefined;
  }

  /** Live rows of a table (tombstones left out), by id. */
  live(table: SyncTable): SyncRow[] {
    return [...this.tables.get(table)!.values()]
      .filter((r) => !r.deletedAt)
      .sort((a, b) => a.id.localeCompare(b.id));
  }

  private write(table: SyncTable, row: SyncRow): void {
    this.version += 1;
    const at = new Date(this.now()).toISOString();
    this.tables.get(table)!.set(row.id, { ...row, version: this.version, updatedAt: at });
  }

  private store(): RowStore {
    const rowsOf = (t: SyncTable) => this.tables.get(t)!;
    const alive = (r: SyncRow | undefined) => (r && !r.deletedAt ? structuredClone(r) : undefined);
    return {
      get: async <T extends SyncTable>(t: T, id: string) =>
        Promise.resolve(alive(rowsOf(t).get(id)) as SyncRowTypes[T] | undefined),
      where: async <T extends SyncTable>(t: T, index: string, value: string) =>
        Promise.resolve(
          [...rowsOf(t).values()]
            .filter((r) => !r.deletedAt && r[index] === value)
            .map((r) => structuredClone(r)) as SyncRowTypes[T][],
        ),
      put: async (t, row) => Promise.resolve(this.write(t, row)),
      remove: async (t, id) => {
        const row = rowsOf(t).get(id);
        if (row) this.write(t, { ...row, deletedAt: new Date(this.now()).toISOString() });
        return Promise.resolve();
      },
    };
  }

  async push({ clientId, mutations }: PushRequest): Promise<PushResponse> {
    const results: MutationOutcome[] = [];
    for (const m of mutations) {
      const last = this.lastMutationId(clientId);
      if (m.id <= last) {
        results.push({ id: m.id, status: 'skipped' });
        continue;
      }
      const outcome = await this.applyOne(m);
      this.clients.set(clientId, m.id);
      results.push(outcome);
      if (outcome.status === 'applied') this.applied.push(`${clientId}:${m.id} ${m.name}`);
    }
    return { lastMutationId: this.lastMutationId(clientId), results, serverTime: this.now() };
  }

  private async applyOne(m: Mutation): Promise<MutationOutcome> {
    const refusal = this.refuse(m);
    if (refusal) return { id: m.id, status: 'rejected', ...refusal };
    for (const sha of blobsReferenced(m.name, m.args)) {
      if (!this.blobs.has(sha)) {
        return {
          id: m.id,
          status: 'rejected',
          code: 'blob-missing',
          message: 'Upload the image first',
        };
      }
    }
    try {
      const { userId, businessId, role } = this.actor;
      await commandDef(m.name).apply(this.store(), m.args as never, {
        userId,
        businessId,
        role,
        atMs: this.now(),
      });
      return { id: m.id, status: 'applied' };
    } catch (error) {
      if (error instanceof CommandRefusedError) {
        return { id: m.id, status: 'rejected', code: error.code, message: error.message };
      }
      throw error;
    }
  }

  /** What the caller may see (a helper: their jobs); everything by default. */
  visible: (table: SyncTable, row: SyncRow) => boolean = () => true;
  /** The caller's scope number: bump it when `visible` changes (a job given or taken away). */
  scope = 0;

  pull(query: PullQuery): PullResponse {
    const reset = query.cursor > 0 && query.scope !== this.scope;
    const cursor = reset ? 0 : query.cursor;
    const newer: { table: SyncTable; row: SyncRow }[] = [];
    for (const table of SYNC_TABLES) {
      for (const row of this.tables.get(table)!.values()) {
        if (row.version > cursor && this.visible(table, row)) {
          newer.push({ table, row: structuredClone(row) });
        }
      }
    }
    newer.sort((a, b) => a.row.version - b.row.version);
    const page = newer.slice(0, Math.min(this.pageSize, query.limit ?? Infinity));
    const changes: PullResponse['changes'] = {};
    for (const { table, row } of page) (changes[table] ??= []).push(row);
    return {
      cursor: page.length ? page[page.length - 1]!.row.version : Math.max(cursor, this.version),
      lastMutationId: this.lastMutationId(query.clientId),
      changes,
      more: newer.length > page.length,
      serverTime: this.now(),
      reset,
      scope: this.scope,
    };
  }

  /** The server as `fetch`, for the app's API client. */
  fetch: typeof fetch = async (input, init) => {
    const url = new URL(input instanceof Request ? input.url : input, 'http://panelpass.example');
    const method = init?.method ?? 'GET';
    const route: Route | null =
      url.pathname === '/api/sync/push'
        ? 'push'
        : url.pathname === '/api/sync/pull'
          ? 'pull'
          : url.pathname.startsWith('/api/blobs/')
            ? 'blob'
            : null;
    if (!route) return json(404, { statusCode: 404, code: 'not-found', message: 'No such route' });
    const fault = this.faults[route].shift();
    if (fault === 'down') throw new TypeError('Failed to fetch');
    if (fault === 'database-down') {
      return json(503, {
        statusCode: 503,
        code: 'database-unavailable',
        message:
          'The server cannot reach its database just now; your changes are kept on the phone.',
      });
    }
    let response: Response;
    if (route === 'push' && method === 'POST') {
      const body = JSON.parse(init?.body as string) as PushRequest;
      this.calls.push(`push ${body.mutations.map((m) => m.id).join(',')}`);
      response = json(200, await this.push(body));
    } else if (route === 'pull') {
      const cursor = Number(url.searchParams.get('cursor'));
      const limit = url.searchParams.get('limit');
      this.calls.push(`pull ${cursor}`);
      this.pullLimits.push(limit === null ? null : Number(limit));
      response = json(
        200,
        this.pull({
          cursor,
          scope: Number(url.searchParams.get('scope')),
          clientId: url.searchParams.get('clientId') ?? '',
          ...(limit === null ? {} : { limit: Number(limit) }),
        }),
      );
    } else {
      const sha = url.pathname.slice('/api/blobs/'.length);
      const data = init?.body as ArrayBuffer;
      this.calls.push(`PUT blob ${sha}`);
      if ((await sha256Hex(data)) !== sha) {
        response = json(400, { statusCode: 400, code: 'hash-mismatch', message: 'Hash differs' });
      } else {
        const headers = new Headers(init?.headers);
        const had = this.blobs.has(sha);
        this.blobs.set(sha, { mime: headers.get('Content-Type') ?? '', size: data.byteLength });
        response = json(had ? 200 : 201, { sha256: sha });
      }
    }
    if (fault === 'lost-answer') throw new TypeError('Failed to fetch');
    return response;
  };
}
