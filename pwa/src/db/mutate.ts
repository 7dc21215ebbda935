import Dexie from 'dexie';
import { isInputError, type CommandArgs, type CommandName } from '@panelpass/shared';
import { commandDef, type ApplyContext } from './commands';
import { CommandRefusedError, isQuotaError, OutOfSpaceError } from './errors';
import type { LocalDb, OutboxEntry, StoredBlob } from './localDb';
import { OptimisticStore } from './rowStore';

/** An image to keep with the mutation that points at it (same transaction). */
export interface NewBlob {
  sha256: string;
  mime: string;
  data: ArrayBuffer;
}

export function contextOf(db: LocalDb, atMs: number): ApplyContext {
  const { userId, businessId, role } = db.owner;
  return { userId, businessId, role, atMs };
}

const iso = (ms: number): string => new Date(ms).toISOString();

/**
 * THE way to change data on the phone. In one Dexie transaction: takes the next mutation id,
 * writes the command's local effect, keeps any image it brings, and appends the mutation to
 * the outbox. Either all of it is stored or none of it (a refused command, a full disk).
 *
 * Throws CommandRefusedError when a rule says no (nothing stored), OutOfSpaceError when the
 * disk is full (nothing stored, nothing before it touched). An unknown name is a bug: throws.
 */
export async function mutate<N extends CommandName>(
  db: LocalDb,
  name: N,
  args: CommandArgs[N],
  options: { blob?: NewBlob } = {},
): Promise<OutboxEntry> {
  const def = commandDef(name);
  let entry: OutboxEntry;
  try {
    entry = await db.transaction('rw', db.writeScope, async () => {
      const deviceNow = db.now();
      const at = deviceNow + (await db.getMeta('serverOffsetMs'));
      // Plain JSON from here on: what is applied here is exactly what the server receives.
      const prepared = JSON.parse(
        JSON.stringify(def.prepare ? def.prepare(args, at) : args),
      ) as CommandArgs[N];
      const id = await db.getMeta('nextMutationId');
      await db.setMeta('nextMutationId', id + 1);
      await def.apply(new OptimisticStore(db), prepared, contextOf(db, at));
      if (options.blob) await keepBlob(db, options.blob, deviceNow);
      const recorded: OutboxEntry = {
        id,
        name,
        args: prepared as unknown as Record<string, unknown>,
        createdAt: iso(deviceNow),
        at,
      };
      await db.outbox.add(recorded);
      return recorded;
    });
  } catch (error) {
    if (isQuotaError(error)) throw new OutOfSpaceError({ cause: error });
    if (isInputError(error)) throw new CommandRefusedError('validation-failed', error.message);
    throw error;
  }
  db.notifyMutation();
  return entry;
}

async function keepBlob(db: LocalDb, blob: NewBlob, deviceNow: number): Promise<void> {
  // The same bytes twice (the same photo attached again) are kept once.
  if (await db.blobs.get(blob.sha256)) return;
  const stored: StoredBlob = {
    sha256: blob.sha256,
    mime: blob.mime,
    data: blob.data,
    size: blob.data.byteLength,
    state: 'pending',
    tries: 0,
    lastError: null,
    createdAt: iso(deviceNow),
  };
  await db.blobs.add(stored);
}

/**
 * Re-applies the pending mutations on top of the server's rows. Call inside a transaction
 * over `db.writeScope`, after the server's rows are in: first every row a pending mutation
 * changed goes back to the server's copy kept in `base`, then the outbox is applied again in
 * order. A mutation the rows no longer allow (the other phone closed the job) keeps no local
 * effect; it stays in the outbox and the server gives the verdict. Answers the ids skipped.
 */
export async function rebase(db: LocalDb): Promise<number[]> {
  const kept = await db.base.toArray();
  for (const entry of kept) {
    const table = db.table(entry.table);
    if (entry.row) await table.put(entry.row);
    else await table.delete(entry.id);
  }
  await db.base.clear();
  const store = new OptimisticStore(db);
  const skipped: number[] = [];
  for (const m of await db.outbox.orderBy('id').toArray()) {
    try {
      await commandDef(m.name).apply(store, m.args as never, contextOf(db, m.at));
    } catch (error) {
      // Storage failures abort the whole pull; a rule that now says no only skips this one.
      if (error instanceof Dexie.DexieError || isQuotaError(error)) throw error;
      skipped.push(m.id);
    }
  }
  return skipped;
}
