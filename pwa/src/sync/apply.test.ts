import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { PullResponse } from '@panelpass/shared';
import type { LocalDb } from '../db/localDb';
import { mutate } from '../db/mutate';
import { aCustomerRow, aVehicleRow, freshIndexedDb, openTestDb, T0 } from '../test/localDb';
import { applyPull, applyPushResult, mergePage, type PulledChanges } from './apply';

let db: LocalDb;
const customer = aCustomerRow({ version: 5 });

beforeEach(async () => {
  db = openTestDb(freshIndexedDb(), undefined, { now: () => T0 });
  await db.rows('customers').put(customer);
});
afterEach(() => db.close());

function pulled(over: Partial<PulledChanges> = {}): PulledChanges {
  return {
    cursor: 10,
    lastMutationId: 0,
    changes: {},
    serverTime: T0 + 1_000,
    reset: false,
    scope: 0,
    ...over,
  };
}

describe('applyPull', () => {
  it('keeps a pending change on top of an older server copy of the row (rebase)', async () => {
    await mutate(db, 'customer.update', { id: customer.id, name: 'Ines Marlowe-Ross' });
    // The other phone changed the phone number; the server has not seen our rename yet.
    const server = { ...customer, version: 7, phone: '0700 222 333' };
    await applyPull(db, pulled({ changes: { customers: [server] } }), 0);
    const row = await db.rows('customers').get(customer.id);
    expect(row).toMatchObject({ name: 'Ines Marlowe-Ross', phone: '0700 222 333', version: 7 });
    expect(await db.outbox.count()).toBe(1);
    // The server's copy is what a later rebase starts from.
    expect((await db.base.get(`customers/${customer.id}`))?.row).toEqual(server);
  });

  it('drops confirmed mutations and shows the server copy once nothing is pending', async () => {
    await mutate(db, 'customer.update', { id: customer.id, name: 'Ines M.' });
    const server = {
      ...customer,
      version: 8,
      name: 'Ines M.',
      updatedAt: '2025-05-02T08:00:01.000Z',
    };
    await applyPull(db, pulled({ lastMutationId: 1, changes: { customers: [server] } }), 250);
    expect(await db.outbox.count()).toBe(0);
    expect(await db.base.count()).toBe(0);
    expect(await db.rows('customers').get(customer.id)).toEqual(server);
    expect(await db.getMeta('lastMutationId')).toBe(1);
    expect(await db.getMeta('cursor')).toBe(10);
    expect(await db.getMeta('lastSyncAt')).toBe(T0 + 1_000);
    expect(await db.getMeta('serverOffsetMs')).toBe(250);
  });

  it("undoes a rejected mutation's effect: the row goes back to the server's copy", async () => {
    const newId = '7e6d5c4b-3a29-4180-9f7e-6d5c4b3a2918';
    const sent = [
      await mutate(db, 'customer.create', { id: newId, name: 'Odile Brack' }),
      await mutate(db, 'customer.update', { id: customer.id, notes: 'Dog in the yard' }),
    ];
    await applyPushResult(
      db,
      sent,
      {
        lastMutationId: 2,
        results: [
          { id: 1, status: 'rejected', code: 'validation-failed', message: 'email is required' },
          { id: 2, status: 'rejected', code: 'forbidden', message: 'Only the owner may' },
        ],
        serverTime: T0 + 500,
      },
      0,
    );
    expect(await db.outbox.count()).toBe(0);
    const rejected = await db.rejected.toArray();
    expect(rejected.map((r) => [r.id, r.name, r.code, r.message])).toEqual([
      [1, 'customer.create', 'validation-failed', 'email is required'],
      [2, 'customer.update', 'forbidden', 'Only the owner may'],
    ]);
    expect(rejected[0]?.args).toEqual({ id: newId, name: 'Odile Brack' });
    // The server changed nothing, so the pull brings nothing: the rebase restores both rows.
    await applyPull(db, pulled({ lastMutationId: 2 }), 0);
    expect(await db.rows('customers').get(newId)).toBeUndefined();
    expect(await db.rows('customers').get(customer.id)).toEqual(customer);
  });

  it('removes a row the server tombstoned', async () => {
    await applyPull(
      db,
      pulled({
        changes: { customers: [{ ...customer, version: 9, deletedAt: '2025-05-02T07:00:00Z' }] },
      }),
      0,
    );
    expect(await db.rows('customers').get(customer.id)).toBeUndefined();
  });

  it('ignores a copy older than the one held', async () => {
    await applyPull(
      db,
      pulled({ changes: { customers: [{ ...customer, version: 3, name: 'Old' }] } }),
      0,
    );
    expect((await db.rows('customers').get(customer.id))?.name).toBe(customer.name);
  });

  it('applies the whole pull in one transaction: a failure part-way stores none of it', async () => {
    db.rows('vehicles').hook('creating', () => {
      throw new Error('disk trouble');
    });
    const renamed = { ...customer, version: 11, name: 'Renamed' };
    await expect(
      applyPull(
        db,
        pulled({
          cursor: 12,
          changes: { customers: [renamed], vehicles: [aVehicleRow({ version: 12 })] },
        }),
        0,
      ),
    ).rejects.toThrow('disk trouble');
    expect((await db.rows('customers').get(customer.id))?.name).toBe(customer.name);
    expect(await db.getMeta('cursor')).toBe(0);
  });

  it('keeps the effect of a mutation the rows no longer allow out, and the mutation in', async () => {
    const jobId = '1c2b3a49-5867-4f3e-9d2c-1b0a99887766';
    await db.rows('vehicles').put(aVehicleRow());
    await mutate(db, 'job.create', {
      id: jobId,
      customerId: customer.id,
      vehicleId: aVehicleRow().id,
      windowStart: '2025-05-03T09:00:00.000Z',
      windowEnd: '2025-05-03T10:00:00.000Z',
    });
    await mutate(db, 'job.setStage', { id: jobId, stage: 'walkaround' });
    const job = await db.rows('jobs').get(jobId);
    // The server applied the create, and the office closed the job meanwhile.
    const closed = { ...job!, version: 20, stage: 'closed' };
    const { skipped } = await applyPull(
      db,
      pulled({ lastMutationId: 1, changes: { jobs: [closed] } }),
      0,
    );
    expect(skipped).toEqual([2]);
    expect((await db.rows('jobs').get(jobId))?.stage).toBe('closed');
    expect((await db.outbox.toArray()).map((m) => m.id)).toEqual([2]);
  });
});

describe('applyPull after a change of scope (reset)', () => {
  it('keeps only what the pull sends, keeps the outbox and re-applies it, and restarts the cursor', async () => {
    const mine = '4d3c2b1a-0f9e-4d8c-8b7a-6f5e4d3c2b1a';
    await db.setMeta('cursor', 40);
    await db.rows('vehicles').put(aVehicleRow());
    await mutate(db, 'customer.create', { id: mine, name: 'Odile Brack' });
    await mutate(db, 'customer.update', { id: customer.id, notes: 'Ring twice' });
    const other = aCustomerRow({ id: '9a8b7c6d-5e4f-4a3b-9c2d-1e0f9a8b7c6d', version: 3 });
    await applyPull(
      db,
      pulled({ reset: true, scope: 2, cursor: 3, changes: { customers: [other] } }),
      0,
    );
    // The vehicle and the first customer are out of scope now; our own new customer is pending.
    expect(await db.rows('vehicles').count()).toBe(0);
    expect((await db.rows('customers').toCollection().primaryKeys()).sort()).toEqual(
      [mine, other.id].sort(),
    );
    expect(await db.outbox.count()).toBe(2);
    expect(await db.getMeta('cursor')).toBe(3);
    expect(await db.getMeta('scope')).toBe(2);
  });
});

describe('mergePage', () => {
  it('keeps the newest copy of a row across pages and the last cursor', () => {
    const page = (cursor: number, version: number, name: string): PullResponse => ({
      cursor,
      lastMutationId: 3,
      changes: { customers: [{ ...customer, version, name }] },
      more: true,
      serverTime: T0,
      reset: false,
      scope: 0,
    });
    const merged = mergePage(mergePage(null, page(5, 5, 'A')), page(9, 9, 'B'));
    expect(merged.cursor).toBe(9);
    expect(merged.changes.customers?.map((r) => r.name)).toEqual(['B']);
  });

  const pageOf = (cursor: number, rows: { id: string; version: number }[], reset = false) =>
    ({
      cursor,
      lastMutationId: 0,
      changes: {
        customers: rows.map(({ id, version }) => ({
          ...customer,
          id,
          version,
          name: `${id}@${version}`,
        })),
      },
      more: true,
      serverTime: T0,
      reset,
      scope: 0,
    }) satisfies PullResponse;

  it('over many pages keeps one copy per row, in first-seen order, never an older one', () => {
    let merged: PulledChanges | null = null;
    for (let p = 0; p < 50; p++) {
      // Each page brings 20 new rows and a newer copy of row p; the last one an older copy.
      const rows = Array.from({ length: 20 }, (_, i) => ({ id: `r${p * 20 + i}`, version: 1 }));
      rows.push({ id: `r${p}`, version: p + 2 });
      if (p === 49) rows.push({ id: 'r0', version: 1 });
      merged = mergePage(merged, pageOf(p + 1, rows));
    }
    const names = merged!.changes.customers!.map((r) => String(r.name));
    expect(names).toHaveLength(1000);
    expect(new Set(names.map((n) => n.split('@')[0])).size).toBe(1000);
    expect(names.slice(0, 3)).toEqual(['r0@2', 'r1@3', 'r2@4']);
    expect(names[999]).toBe('r999@1');
  });

  it('a reset page drops what came before it', () => {
    const before = mergePage(null, pageOf(4, [{ id: 'a', version: 3 }]));
    const after = mergePage(before, pageOf(2, [{ id: 'b', version: 1 }], true));
    const next = mergePage(after, pageOf(6, [{ id: 'a', version: 1 }]));
    expect(next.reset).toBe(true);
    expect(next.changes.customers!.map((r) => r.name)).toEqual(['b@1', 'a@1']);
  });
});
