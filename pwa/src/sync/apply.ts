import {
  SYNC_TABLES,
  type PullResponse,
  type PushResponse,
  type RejectedMutation,
  type SyncRow,
  type SyncTable,
} from '@panelpass/shared';
import type { BaseEntry, LocalDb, OutboxEntry } from '../db/localDb';
import { rebase } from '../db/mutate';
import { baseKey } from '../db/rowStore';

const iso = (ms: number): string => new Date(ms).toISOString();

/** A pull of one or more pages, merged: the newest copy of each row. */
export interface PulledChanges {
  cursor: number;
  lastMutationId: number;
  changes: Partial<Record<SyncTable, SyncRow[]>>;
  serverTime: number;
  /** What the person may see changed: the phone's synced rows are replaced by these. */
  reset: boolean;
  scope: number;
}

/** Where each row of a merge sits in its table's list, by id (kept beside the merge). */
const positions = new WeakMap<PulledChanges, Map<SyncTable, Map<string, number>>>();

/**
 * Adds a page to what was pulled so far (a later version of a row replaces an earlier one).
 * Linear in the page: a first pull of a year is some 30 pages (90 at the server's default size).
 */
export function mergePage(into: PulledChanges | null, page: PullResponse): PulledChanges {
  // A reset starts again from nothing: what came before it no longer counts.
  const merged: PulledChanges =
    into && !page.reset
      ? into
      : {
          cursor: page.cursor,
          lastMutationId: page.lastMutationId,
          changes: {},
          serverTime: page.serverTime,
          reset: page.reset,
          scope: page.scope,
        };
  merged.scope = page.scope;
  merged.cursor = Math.max(merged.cursor, page.cursor);
  merged.lastMutationId = Math.max(merged.lastMutationId, page.lastMutationId);
  merged.serverTime = Math.max(merged.serverTime, page.serverTime);
  let tables = positions.get(merged);
  if (!tables) positions.set(merged, (tables = new Map<SyncTable, Map<string, number>>()));
  for (const table of SYNC_TABLES) {
    const rows = page.changes[table];
    if (!rows?.length) continue;
    const list = (merged.changes[table] ??= []);
    let at = tables.get(table);
    if (!at) tables.set(table, (at = new Map(list.map((r, i) => [r.id, i]))));
    for (const row of rows) {
      const i = at.get(row.id);
      if (i === undefined) {
        at.set(row.id, list.length);
        list.push(row);
      } else if (list[i]!.version <= row.version) list[i] = row;
    }
  }
  return merged;
}

async function advanceCounters(
  db: LocalDb,
  lastMutationId: number,
  serverOffsetMs: number,
): Promise<void> {
  const confirmed = Math.max(await db.getMeta('lastMutationId'), lastMutationId);
  await db.setMeta('lastMutationId', confirmed);
  // Never hand out an id the server has already dealt with: it would be skipped as a retry.
  const next = await db.getMeta('nextMutationId');
  if (next <= confirmed) await db.setMeta('nextMutationId', confirmed + 1);
  await db.setMeta('serverOffsetMs', serverOffsetMs);
}

function rejectedFrom(m: OutboxEntry, outcome: PushResponse['results'][number], at: number) {
  if (outcome.status !== 'rejected') return null;
  const { id, name, args, createdAt } = m;
  const rejected: RejectedMutation = {
    id,
    name,
    args,
    createdAt,
    code: outcome.code,
    message: outcome.message,
    ...(outcome.details === undefined ? {} : { details: outcome.details }),
    rejectedAt: iso(at),
  };
  return rejected;
}

/**
 * What the server said to a push, in one transaction: refused mutations are kept with its
 * reason, every mutation up to its `lastMutationId` leaves the outbox. The local effects stay
 * until the pull that follows brings the server's rows and rebases (a rejected one's effect
 * is undone there), so nothing flickers in between.
 */
export async function applyPushResult(
  db: LocalDb,
  sent: readonly OutboxEntry[],
  response: PushResponse,
  serverOffsetMs: number,
): Promise<void> {
  await db.transaction('rw', [db.outbox, db.rejected, db.meta], async () => {
    const byId = new Map(sent.map((m) => [m.id, m]));
    for (const outcome of response.results) {
      const m = byId.get(outcome.id);
      const rejected = m && rejectedFrom(m, outcome, response.serverTime);
      if (rejected) await db.rejected.put(rejected);
    }
    await db.outbox.where('id').belowOrEqual(response.lastMutationId).delete();
    await advanceCounters(db, response.lastMutationId, serverOffsetMs);
  });
}

/**
 * A whole pull in ONE transaction: the server's rows go in (a tombstone removes the row on
 * the phone; a copy older than the one held is ignored), mutations the server has dealt with
 * leave the outbox, and the still-pending ones are re-applied on top (rebase). A failure
 * anywhere — a full disk included — rolls all of it back and the next sync tries again.
 */
export async function applyPull(
  db: LocalDb,
  pulled: PulledChanges,
  serverOffsetMs: number,
): Promise<{ skipped: number[] }> {
  return db.transaction('rw', db.writeScope, async () => {
    const bases = new Map((await db.base.toArray()).map((b) => [b.key, b]));
    const changedBases: BaseEntry[] = [];
    if (pulled.reset) {
      // Only what this pull sends is the server's now; the outbox stays and is re-applied.
      for (const table of SYNC_TABLES) await db.table(table).clear();
      for (const base of bases.values()) {
        base.row = null;
        changedBases.push(base);
      }
    }
    for (const table of SYNC_TABLES) {
      const rows = pulled.changes[table];
      if (!rows?.length) continue;
      const store = db.table<SyncRow, string>(table);
      // A fresh phone's first pull, or a reset (cleared above), has nothing to compare with:
      // one count instead of a read per row (10,000 reads cost about a third of applying).
      const held: (SyncRow | undefined)[] =
        (await store.count()) === 0 ? [] : await store.bulkGet(rows.map((r) => r.id));
      const live: SyncRow[] = [];
      const gone: string[] = [];
      rows.forEach((row, i) => {
        const base = bases.get(baseKey(table, row.id));
        // A row a pending mutation changed is compared with the server copy it started from.
        const current = base ? base.row : held[i];
        if (current && current.version > row.version) return;
        if (row.deletedAt) gone.push(row.id);
        else live.push(row);
        if (base) {
          base.row = row.deletedAt ? null : row;
          changedBases.push(base);
        }
      });
      if (live.length) await store.bulkPut(live);
      if (gone.length) await store.bulkDelete(gone);
    }
    if (changedBases.length) await db.base.bulkPut(changedBases);
    await db.outbox.where('id').belowOrEqual(pulled.lastMutationId).delete();
    await advanceCounters(db, pulled.lastMutationId, serverOffsetMs);
    const cursor = pulled.reset
      ? pulled.cursor
      : Math.max(await db.getMeta('cursor'), pulled.cursor);
    await db.setMeta('cursor', cursor);
    await db.setMeta('scope', pulled.scope);
    await db.setMeta('lastSyncAt', pulled.serverTime);
    const needsRebase = bases.size > 0 || (await db.outbox.count()) > 0;
    return { skipped: needsRebase ? await rebase(db) : [] };
  });
}
