import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { childId, type ProductRow } from '@panelpass/shared';
import { applyPull } from '../sync/apply';
import {
  aCustomerRow,
  aHelper,
  aVehicleRow,
  freshIndexedDb,
  openTestDb,
  T0,
} from '../test/localDb';
import { CommandRefusedError } from './errors';
import type { LocalDb } from './localDb';
import { mutate } from './mutate';

/*
 * The Shelf's commands on the phone (product.create, product.update, stock.adjust) and the
 * stock a phone shows: the server's count, less the uses logged here and not yet sent.
 */

let db: LocalDb;
const jobId = '5b0e7c1a-2d3f-4e5a-8b6c-7d8e9f0a1b2c';
const productId = '9f8e7d6c-5b4a-4392-8170-6f5e4d3c2b1a';

function aProduct(over: Partial<ProductRow> = {}): ProductRow {
  return {
    id: productId,
    businessId: 'b-heronwake',
    version: 3,
    createdAt: '2025-05-01T10:00:00.000Z',
    updatedAt: '2025-05-01T10:00:00.000Z',
    deletedAt: null,
    name: 'Medium cut polish',
    kind: 'polish',
    properties: { cutLevel: 5, finishLevel: 7 },
    unit: 'mL',
    stockQty: 100,
    amountPerUse: 8,
    unitCostMinor: 4,
    lowStockAt: 50,
    sdsUrl: null,
    ...over,
  };
}

beforeEach(async () => {
  db = openTestDb(freshIndexedDb(), undefined, { now: () => T0 });
  await db.rows('customers').put(aCustomerRow());
  await db.rows('vehicles').put(aVehicleRow());
  await db.rows('products').put(aProduct());
});
afterEach(() => db.close());

const stockOf = async (id = productId) => (await db.rows('products').get(id))?.stockQty;

async function logPass(id: string) {
  const panelId = childId(jobId, 'panel:hood');
  return mutate(db, 'pass.log', {
    id,
    jobId,
    panelId,
    step: 'polish',
    machine: 'dual-action',
    pad: 'Foam polishing pad',
    productId,
    speedSetting: '4',
    passes: 2,
    result: 'another-pass',
  });
}

async function bookJob() {
  await mutate(db, 'job.create', {
    id: jobId,
    customerId: aCustomerRow().id,
    vehicleId: aVehicleRow().id,
    windowStart: '2025-05-03T09:00:00.000Z',
    windowEnd: '2025-05-03T12:00:00.000Z',
  });
}

describe('product.create on the phone', () => {
  it('puts the product on the Shelf with its opening stock as a movement, once', async () => {
    const id = '1e2d3c4b-5a69-4788-9a0b-1c2d3e4f5a6b';
    const args = {
      id,
      name: 'Panel wipe',
      kind: 'cleaner' as const,
      properties: { dilution: { concentrateParts: 1, waterParts: 9 } },
      stockQty: 1000,
      lowStockAt: 250,
      unitCostMinor: 1.5,
    };
    await mutate(db, 'product.create', args);
    await mutate(db, 'product.create', args);
    expect(await db.rows('products').get(id)).toMatchObject({
      name: 'Panel wipe',
      stockQty: 1000,
      lowStockAt: 250,
      version: 0,
    });
    const moves = await db.rows('stock_movements').where('productId').equals(id).toArray();
    expect(moves).toEqual([
      expect.objectContaining({ id: childId(id, 'opening-stock'), qty: 1000, reason: 'adjust' }),
    ]);
  });

  it('is the owner’s: a helper’s phone refuses it and stores nothing', async () => {
    db.close();
    db = openTestDb(freshIndexedDb(), aHelper, { now: () => T0 });
    await expect(
      mutate(db, 'product.create', { id: productId, name: 'Tape', kind: 'tape' }),
    ).rejects.toThrow(CommandRefusedError);
    expect(await db.outbox.count()).toBe(0);
  });
});

describe('product.update on the phone', () => {
  it('changes only the fields sent', async () => {
    await mutate(db, 'product.update', { id: productId, lowStockAt: 120, name: ' Medium polish ' });
    expect(await db.rows('products').get(productId)).toMatchObject({
      name: 'Medium polish',
      lowStockAt: 120,
      stockQty: 100,
      unit: 'mL',
      properties: { cutLevel: 5, finishLevel: 7 },
    });
  });
});

describe('stock.adjust on the phone', () => {
  it('adds a delivery once per movement id and takes its unit cost', async () => {
    const args = {
      id: 'a5b4c3d2-e1f0-4a9b-8c7d-6e5f4a3b2c1d',
      productId,
      qty: 500,
      reason: 'restock' as const,
      unitCostMinor: 3.2,
    };
    await mutate(db, 'stock.adjust', args);
    await mutate(db, 'stock.adjust', args);
    expect(await db.rows('products').get(productId)).toMatchObject({
      stockQty: 600,
      unitCostMinor: 3.2,
    });
  });

  it('refuses to go below zero in the server’s words, storing nothing', async () => {
    const refused = mutate(db, 'stock.adjust', {
      id: 'b5b4c3d2-e1f0-4a9b-8c7d-6e5f4a3b2c1d',
      productId,
      qty: -101,
      reason: 'adjust',
    });
    await expect(refused).rejects.toMatchObject({
      code: 'stock-below-zero',
      message: 'Only 100 mL in stock; this would take it below zero',
    });
    expect(await stockOf()).toBe(100);
    expect(await db.outbox.count()).toBe(0);
  });
});

describe('uses logged in the field', () => {
  it('take amountPerUse once per record, and survive a pull of the older server copy', async () => {
    await bookJob();
    const passId = 'c1c2c3c4-d5d6-4e7e-8f9f-a0a1a2a3a4a5';
    await logPass(passId);
    await logPass(passId); // the same record again: no second use
    expect(await stockOf()).toBe(92);
    await mutate(db, 'stock.adjust', {
      id: 'd1c2c3c4-d5d6-4e7e-8f9f-a0a1a2a3a4a5',
      productId,
      qty: 10,
      reason: 'adjust',
    });
    expect(await stockOf()).toBe(102);

    // A pull brings the server's copy, which has seen none of it: the pending use and the
    // count are applied again on top of it, once each.
    await applyPull(
      db,
      {
        cursor: 20,
        lastMutationId: 0,
        changes: { products: [aProduct({ version: 4, stockQty: 90 })] },
        serverTime: T0,
        reset: false,
        scope: 0,
      },
      0,
    );
    expect(await stockOf()).toBe(92);

    // The server confirms the four mutations (booking, the pass twice, the count) and sends
    // its own count: the phone shows it as is.
    await applyPull(
      db,
      {
        cursor: 30,
        lastMutationId: 4,
        changes: { products: [aProduct({ version: 6, stockQty: 92 })] },
        serverTime: T0,
        reset: false,
        scope: 0,
      },
      0,
    );
    expect(await db.outbox.count()).toBe(0);
    expect(await stockOf()).toBe(92);
  });

  it('a product whose uses are not counted keeps its stock', async () => {
    await db.rows('products').put(aProduct({ amountPerUse: 0 }));
    await bookJob();
    await logPass('e1c2c3c4-d5d6-4e7e-8f9f-a0a1a2a3a4a5');
    expect(await stockOf()).toBe(100);
  });
});
