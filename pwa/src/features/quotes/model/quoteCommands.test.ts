import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { CommandRefusedError } from '../../../db/errors';
import type { LocalDb } from '../../../db/localDb';
import { mutate } from '../../../db/mutate';
import {
  aCustomerRow,
  aHelper,
  aVehicleRow,
  freshIndexedDb,
  openTestDb,
  T0,
} from '../../../test/localDb';

// The phone's effects of the quote commands mirror the server's rules (QuotesService):
// owner only, draft or sent quotes only, a send needs the customer's address, an acceptance
// books one job at the offered window.

let db: LocalDb;
const quoteId = '7c4f0f1e-1b2a-4c3d-8e9f-0a1b2c3d4e5f';
const jobId = '8d5a1b2c-3d4e-4f5a-9b6c-7d8e9f0a1b2c';
const inputs = {
  sizeClass: 'medium',
  condition: 'light',
  serviceIds: ['wash'],
  chips: 2,
  addOnIds: [],
  windowStart: '2025-05-06T08:00:00+01:00',
  windowEnd: '2025-05-06T12:00:00+01:00',
};

beforeEach(async () => {
  db = openTestDb(freshIndexedDb(), undefined, { now: () => T0 });
  await db.rows('customers').put(aCustomerRow());
  await db.rows('vehicles').put(aVehicleRow());
});
afterEach(() => db.close());

const create = (target = db) =>
  mutate(target, 'quote.create', {
    id: quoteId,
    customerId: aCustomerRow().id,
    vehicleId: aVehicleRow().id,
    inputs,
  });

describe('quote commands on the phone', () => {
  it('keeps a new quote as a draft with its inputs, the offered times as ISO, once', async () => {
    await create();
    await create();
    const row = await db.rows('quotes').get(quoteId);
    expect(row).toMatchObject({ status: 'draft', customerId: aCustomerRow().id, version: 0 });
    expect(row?.inputs.windowStart).toBe('2025-05-06T07:00:00.000Z');
    const [first] = await db.outbox.toArray();
    expect((first?.args as { inputs: typeof inputs }).inputs.windowEnd).toBe(
      '2025-05-06T11:00:00.000Z',
    );
  });

  it('sends a draft, then refuses changes once accepted; accepting books one job at the offered window', async () => {
    await create();
    await mutate(db, 'quote.send', { id: quoteId });
    expect((await db.rows('quotes').get(quoteId))?.status).toBe('sent');
    await mutate(db, 'quote.accept', { id: quoteId, jobId });
    await mutate(db, 'quote.accept', {
      id: quoteId,
      jobId: '9e6b2c3d-4e5f-4a6b-8c7d-8e9f0a1b2c3d',
    });
    const jobs = await db.rows('jobs').toArray();
    expect(jobs.map((j) => [j.id, j.quoteId, j.windowStart, j.stage])).toEqual([
      [jobId, quoteId, '2025-05-06T07:00:00.000Z', 'booked'],
    ]);
    expect(await db.rows('quotes').get(quoteId)).toMatchObject({ status: 'accepted', jobId });
    await expect(mutate(db, 'quote.update', { id: quoteId, inputs })).rejects.toMatchObject({
      code: 'quote-status',
    });
  });

  it('refuses to send to a customer with no e-mail address, and a visit that ends before it starts', async () => {
    await db.rows('customers').put(aCustomerRow({ email: null }));
    await create();
    await expect(mutate(db, 'quote.send', { id: quoteId })).rejects.toMatchObject({
      code: 'no-email',
    });
    await expect(
      mutate(db, 'quote.update', {
        id: quoteId,
        inputs: { ...inputs, windowEnd: '2025-05-06T06:00:00Z' },
      }),
    ).rejects.toBeInstanceOf(CommandRefusedError);
    expect((await db.rows('quotes').get(quoteId))?.status).toBe('draft');
  });

  it('is the owner’s: a helper’s phone refuses to make a quote', async () => {
    const helperDb = openTestDb(freshIndexedDb(), aHelper, { now: () => T0 });
    await helperDb.rows('customers').put(aCustomerRow());
    await helperDb.rows('vehicles').put(aVehicleRow());
    await expect(create(helperDb)).rejects.toMatchObject({ code: 'forbidden' });
    helperDb.close();
  });
});
