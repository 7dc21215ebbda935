import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { PaymentRow } from '@panelpass/shared';
import {
  aCustomerRow,
  aHelper,
  aVehicleRow,
  freshIndexedDb,
  openTestDb,
  T0,
} from '../test/localDb';
import type { LocalDb } from './localDb';
import { mutate } from './mutate';

/*
 * payment.request on the phone: asked for offline, kept as a pending card payment with no
 * link until the server has made one, sent with the exact fields the server's command takes.
 */

let factory: IDBFactory;
let db: LocalDb;

const jobId = '7c2d1e0f-3a4b-4c5d-8e6f-9a0b1c2d3e4f';
const cardOp = '1e2d3c4b-5a69-4788-97a6-b5c4d3e2f1a0';

beforeEach(async () => {
  factory = freshIndexedDb();
  db = openTestDb(factory, undefined, { now: () => T0 });
  await db.rows('customers').put(aCustomerRow());
  await db.rows('vehicles').put(aVehicleRow());
  await mutate(db, 'job.create', {
    id: jobId,
    customerId: aCustomerRow().id,
    vehicleId: aVehicleRow().id,
    windowStart: '2025-05-02T07:00:00.000Z',
    windowEnd: '2025-05-02T12:00:00.000Z',
    priceMinor: 48_000,
  });
  await mutate(db, 'payment.recordCash', {
    id: 'cash-1',
    opId: 'cash-op-1',
    jobId,
    kind: 'deposit',
    method: 'cash',
    amountMinor: 8_000,
  });
});

afterEach(() => db.close());

const cardRows = async (): Promise<PaymentRow[]> =>
  (await db.rows('payments').where('jobId').equals(jobId).toArray())
    .filter((p) => p.method === 'card')
    .sort((a, b) => a.id.localeCompare(b.id));

describe('payment.request on the phone', () => {
  it('keeps a pending card payment for what is due, with no link yet, and queues the request', async () => {
    const entry = await mutate(db, 'payment.request', {
      id: 'card-1',
      opId: cardOp,
      jobId,
      kind: 'balance',
    });
    const [row] = await cardRows();
    expect(row).toMatchObject({
      id: 'card-1',
      opId: cardOp,
      kind: 'balance',
      method: 'card',
      status: 'pending',
      amountMinor: 40_000,
      checkoutUrl: null,
    });
    // Exactly the server's fields (its DTO refuses anything else), opId included.
    expect(entry.name).toBe('payment.request');
    expect(entry.args).toEqual({ id: 'card-1', opId: cardOp, jobId, kind: 'balance' });
    expect((await db.outbox.toArray()).map((e) => e.name)).toContain('payment.request');
  });

  it('records one payment per opId: the same request recorded again adds nothing', async () => {
    await mutate(db, 'payment.request', { id: 'card-1', opId: cardOp, jobId, kind: 'balance' });
    await mutate(db, 'payment.request', { id: 'card-2', opId: cardOp, jobId, kind: 'balance' });
    expect((await cardRows()).map((p) => p.id)).toEqual(['card-1']);
  });

  it("a new request replaces the job's older open link of the same kind, as the server does", async () => {
    await mutate(db, 'payment.request', { id: 'card-1', opId: cardOp, jobId, kind: 'balance' });
    await mutate(db, 'payment.request', {
      id: 'card-2',
      opId: '2f3e4d5c-6b7a-4899-a8b7-c6d5e4f3a2b1',
      jobId,
      kind: 'balance',
      amountMinor: 10_000,
    });
    expect((await cardRows()).map((p) => [p.id, p.status, p.amountMinor])).toEqual([
      ['card-1', 'expired', 40_000],
      ['card-2', 'pending', 10_000],
    ]);
  });

  it('says no at once, storing nothing, when nothing is due or more than is due is asked', async () => {
    const before = await db.outbox.count();
    await expect(
      mutate(db, 'payment.request', {
        id: 'card-1',
        opId: cardOp,
        jobId,
        kind: 'balance',
        amountMinor: 40_001,
      }),
    ).rejects.toMatchObject({ code: 'amount-exceeds-due' });
    await mutate(db, 'payment.recordCash', {
      id: 'cash-2',
      opId: 'cash-op-2',
      jobId,
      kind: 'balance',
      method: 'cheque',
      amountMinor: 40_000,
    });
    await expect(
      mutate(db, 'payment.request', { id: 'card-1', opId: cardOp, jobId, kind: 'balance' }),
    ).rejects.toMatchObject({ code: 'nothing-due' });
    expect(await cardRows()).toEqual([]);
    expect(await db.outbox.count()).toBe(before + 1);
  });

  it('refuses cash above what is due on the phone too, as the server does, and queues nothing', async () => {
    const before = await db.outbox.count();
    await expect(
      mutate(db, 'payment.recordCash', {
        id: 'cash-over',
        opId: 'cash-op-over',
        jobId,
        kind: 'balance',
        method: 'cash',
        amountMinor: 40_001,
      }),
    ).rejects.toMatchObject({ code: 'amount-exceeds-due' });
    expect(await db.rows('payments').get('cash-over')).toBeUndefined();
    expect(await db.outbox.count()).toBe(before);
  });

  it("leaves the amount to the server on a helper's phone (it has no price)", async () => {
    const helperDb = openTestDb(freshIndexedDb(), aHelper, { now: () => T0 });
    const { priceMinor: _hidden, ...job } = (await db.rows('jobs').get(jobId))!;
    await helperDb.rows('jobs').put(job);
    await mutate(helperDb, 'payment.request', {
      id: 'card-9',
      opId: cardOp,
      jobId,
      kind: 'balance',
    });
    expect(await helperDb.rows('payments').get('card-9')).toMatchObject({
      status: 'pending',
      amountMinor: 0,
      recordedBy: aHelper.userId,
    });
    helperDb.close();
  });
});
