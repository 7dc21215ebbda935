import Dexie from 'dexie';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { childId, flushBy, type CommandName } from '@panelpass/shared';
import {
  aCustomerRow,
  aHelper,
  aVehicleRow,
  freshIndexedDb,
  openTestDb,
  T0,
} from '../test/localDb';
import { CommandRefusedError, isQuotaError, OUT_OF_SPACE_MESSAGE, OutOfSpaceError } from './errors';
import { attachPhoto, recordHash, sha256Hex } from './images';
import type { LocalDb } from './localDb';
import { mutate } from './mutate';

let factory: IDBFactory;
let db: LocalDb;
let now: number;

beforeEach(async () => {
  factory = freshIndexedDb();
  now = T0;
  db = openTestDb(factory, undefined, { now: () => now });
  await db.rows('customers').put(aCustomerRow());
  await db.rows('vehicles').put(aVehicleRow());
});

afterEach(() => db.close());

const jobId = '5b0e7c1a-2d3f-4e5a-8b6c-7d8e9f0a1b2c';
const solventId = '0d9c8b7a-6f5e-4d3c-9b2a-1f0e9d8c7b6a';

async function bookJob(target = db) {
  return mutate(target, 'job.create', {
    id: jobId,
    customerId: aCustomerRow().id,
    vehicleId: aVehicleRow().id,
    windowStart: '2025-05-03T09:00:00.000Z',
    windowEnd: '2025-05-03T12:00:00.000Z',
  });
}

describe('mutate: effect and outbox in one transaction', () => {
  it('writes the local effect and the outbox entry together', async () => {
    const entry = await mutate(db, 'customer.update', { id: aCustomerRow().id, phone: '0700 1' });
    expect(entry).toMatchObject({
      id: 1,
      name: 'customer.update',
      createdAt: new Date(T0).toISOString(),
    });
    expect((await db.rows('customers').get(aCustomerRow().id))?.phone).toBe('0700 1');
    expect(await db.outbox.toArray()).toEqual([entry]);
  });

  it('stores neither the effect nor the entry when the command is refused', async () => {
    await bookJob();
    await expect(mutate(db, 'job.setStage', { id: jobId, stage: 'finish' })).rejects.toThrow(
      CommandRefusedError,
    );
    expect((await db.rows('jobs').get(jobId))?.stage).toBe('booked');
    expect(await db.outbox.count()).toBe(1);
    expect(await db.getMeta('nextMutationId')).toBe(2);
  });

  it('rolls back the writes already made when a later write of the same command fails', async () => {
    // job.create writes the job, then its panels: make the panels fail.
    db.rows('job_panels').hook('creating', () => {
      throw new Error('disk trouble');
    });
    await expect(bookJob()).rejects.toThrow('disk trouble');
    expect(await db.rows('jobs').get(jobId)).toBeUndefined();
    expect(await db.outbox.count()).toBe(0);
    expect(await db.base.count()).toBe(0);
  });

  it('throws on an unknown command name and stores nothing', async () => {
    await expect(mutate(db, 'panel.polish' as CommandName, { id: 'x' })).rejects.toThrow(
      /Unknown command "panel.polish"/,
    );
    expect(await db.outbox.count()).toBe(0);
  });

  it('numbers mutations 1, 2, 3… without gaps, across a reload and past a refused one', async () => {
    await bookJob();
    await mutate(db, 'job.setStage', { id: jobId, stage: 'walkaround' });
    await expect(mutate(db, 'job.setStage', { id: jobId, stage: 'closed' })).rejects.toThrow();
    db.close();
    const reopened = openTestDb(factory, undefined, { now: () => now });
    const third = await mutate(reopened, 'job.setStage', { id: jobId, stage: 'prep' });
    expect(third.id).toBe(3);
    expect((await reopened.outbox.toArray()).map((m) => m.id)).toEqual([1, 2, 3]);
    // The outbox emptying (all confirmed) does not restart the count.
    await reopened.outbox.clear();
    expect((await mutate(reopened, 'job.setStage', { id: jobId, stage: 'correction' })).id).toBe(4);
    reopened.close();
  });
});

describe('mutate: a full disk', () => {
  it('says so in words and leaves what was stored intact', async () => {
    await bookJob();
    const before = await db.rows('jobs').get(jobId);
    db.outbox.hook('creating', () => {
      throw new Dexie.AbortError(
        'Transaction aborted',
        new DOMException('The quota has been exceeded.', 'QuotaExceededError'),
      );
    });
    const attempt = mutate(db, 'job.update', { id: jobId, notes: 'Gate code 4412' });
    await expect(attempt).rejects.toBeInstanceOf(OutOfSpaceError);
    await expect(attempt).rejects.toThrow(OUT_OF_SPACE_MESSAGE);
    expect(await db.rows('jobs').get(jobId)).toEqual(before);
    expect(await db.outbox.count()).toBe(1);
    expect(await db.getMeta('nextMutationId')).toBe(2);
  });

  it('recognises the quota error in each shape it arrives in', () => {
    const quota = new DOMException('full', 'QuotaExceededError');
    expect(isQuotaError(quota)).toBe(true);
    expect(isQuotaError(new Dexie.AbortError('aborted', quota))).toBe(true);
    expect(isQuotaError(new Error('x', { cause: quota }))).toBe(true);
    expect(isQuotaError(new Dexie.AbortError('aborted'))).toBe(false);
    expect(isQuotaError(new Error('other'))).toBe(false);
  });
});

describe('local effects', () => {
  it('job.create makes the panels and checklist the server makes, with the same ids', async () => {
    await bookJob();
    const panels = await db
      .rows('job_panels')
      .where('[jobId+position]')
      .between([jobId, 0], [jobId, 99])
      .toArray();
    expect(panels.length).toBeGreaterThan(5);
    expect(panels[0]!.id).toBe(childId(jobId, `panel:${panels[0]!.panelKey}`));
    const checks = await db.rows('checklist_items').where('jobId').equals(jobId).count();
    expect(checks).toBe(12);
    expect((await db.rows('jobs').get(jobId))?.address).toBe(aCustomerRow().address);
  });

  it('reading.add stores µm (1 mil = 25.4 µm) and refuses a magnetic gauge on plastic', async () => {
    await bookJob();
    const hood = childId(jobId, 'panel:hood');
    await mutate(db, 'reading.add', {
      id: 'r-1',
      jobId,
      panelId: hood,
      phase: 'before',
      readings: [4.5, 5],
      unit: 'mil',
      gaugeType: 'magnetic-eddy',
    });
    const reading = await db.rows('film_readings').get('r-1');
    expect(reading?.readingsUm).toEqual([114.3, 127]);
    expect(reading?.takenAt).toBe(new Date(T0).toISOString());
    const bumper = childId(jobId, 'panel:front-bumper');
    await expect(
      mutate(db, 'reading.add', {
        id: 'r-2',
        jobId,
        panelId: bumper,
        phase: 'before',
        readings: [120],
        unit: 'um',
        gaugeType: 'magnetic',
      }),
    ).rejects.toMatchObject({ code: 'gauge-not-valid-on-substrate' });
  });

  it('solvent.apply starts its flush timer; solvent.flush stops it once', async () => {
    await bookJob();
    await db.rows('products').put({
      id: 'p-tar',
      businessId: 'b-heronwake',
      version: 3,
      createdAt: '',
      updatedAt: '',
      deletedAt: null,
      name: 'Tarlift 2',
      kind: 'solvent',
      properties: { maxDwellMin: 4 },
      unit: 'mL',
      stockQty: 500,
      amountPerUse: 10,
      lowStockAt: 100,
      sdsUrl: null,
    });
    await mutate(db, 'solvent.apply', {
      id: solventId,
      jobId,
      productId: 'p-tar',
      surfaceTempC: 28,
      inSun: false,
    });
    const app = await db.rows('solvent_applications').get(solventId);
    const expected = flushBy({
      appliedAtMs: T0,
      product: { maxDwellMin: 4 },
      surfaceC: 28,
      inSun: false,
    });
    expect(app?.flushBy).toBe(new Date(expected.flushByMs).toISOString());
    const timer = await db.rows('timers').get(childId(solventId, 'timer'));
    expect(timer).toMatchObject({ kind: 'flush', endsAt: app?.flushBy, acknowledgedAt: null });

    now = T0 + 60_000;
    await mutate(db, 'solvent.flush', { id: solventId });
    now = T0 + 120_000;
    await mutate(db, 'solvent.flush', { id: solventId });
    expect((await db.rows('solvent_applications').get(solventId))?.flushedAt).toBe(
      new Date(T0 + 60_000).toISOString(),
    );
    expect((await db.rows('timers').get(childId(solventId, 'timer')))?.acknowledgedAt).toBe(
      new Date(T0 + 60_000).toISOString(),
    );
  });

  it('fills a default time into the arguments before recording (a rebase gives the same rows)', async () => {
    await db.setMeta('serverOffsetMs', 5_000);
    await mutate(db, 'timer.start', {
      id: 't-1',
      kind: 'custom',
      label: 'Rinse',
      durationMs: 60_000,
    });
    const [entry] = await db.outbox.toArray();
    expect(entry?.args.startedAt).toBe(new Date(T0 + 5_000).toISOString());
    expect(entry?.at).toBe(T0 + 5_000);
  });

  it('pass.log with result done marks the panel done', async () => {
    await bookJob();
    const hood = childId(jobId, 'panel:hood');
    await mutate(db, 'pass.log', {
      id: 'ps-1',
      jobId,
      panelId: hood,
      step: 'polish',
      machine: 'dual-action',
      pad: 'Foam, medium',
      speedSetting: '4',
      passes: 2,
      result: 'done',
    });
    expect((await db.rows('job_panels').get(hood))?.state).toBe('done');
  });

  it('payment.recordCash is stored once per operation id', async () => {
    await bookJob();
    await mutate(db, 'job.update', { id: jobId, priceMinor: 20_000 });
    const cash = {
      jobId,
      kind: 'deposit',
      method: 'cash',
      amountMinor: 5000,
      opId: 'op-1',
    } as const;
    await mutate(db, 'payment.recordCash', { id: 'pay-1', ...cash });
    await mutate(db, 'payment.recordCash', { id: 'pay-2', ...cash });
    expect(await db.rows('payments').count()).toBe(1);
  });

  it('a closed job takes no new field records', async () => {
    await bookJob();
    await db.rows('jobs').update(jobId, { stage: 'closed' });
    await expect(
      mutate(db, 'pin.add', { id: 'pin-1', jobId, x: 0.5, y: 0.5, kind: 'chip', severity: 1 }),
    ).rejects.toMatchObject({ code: 'job-closed' });
  });

  it('a helper may not add customers (the owner does)', async () => {
    const helperDb = openTestDb(factory, aHelper);
    await expect(
      mutate(helperDb, 'customer.create', { id: 'c-9', name: 'Rue Calder' }),
    ).rejects.toMatchObject({ code: 'forbidden' });
    helperDb.close();
  });
});

describe('images', () => {
  it('keeps the photo bytes with the photo.attach mutation, named by SHA-256', async () => {
    const data = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 1, 2, 3]);
    const entry = await attachPhoto(db, {
      id: 'ph-1',
      vehicleId: aVehicleRow().id,
      kind: 'before',
      data,
      mime: 'image/png',
      width: 1,
      height: 1,
    });
    const sha = await sha256Hex(data);
    expect(sha).toMatch(/^[0-9a-f]{64}$/);
    expect(entry.args).toMatchObject({ sha256: sha, bytes: 7, mime: 'image/png' });
    expect(await db.blobs.get(sha)).toMatchObject({ state: 'pending', size: 7, tries: 0 });
  });

  it("files a job's photo under the job's vehicle, as the server does", async () => {
    await bookJob();
    const entry = await attachPhoto(db, {
      id: 'b7a6c5d4-e3f2-4a1b-9c8d-7e6f5a4b3c2d',
      jobId,
      kind: 'damage',
      data: new Uint8Array([1, 2, 3]),
      mime: 'image/jpeg',
      width: 1,
      height: 1,
    });
    expect((await db.rows('photos').get(entry.args.id as string))?.vehicleId).toBe(
      aVehicleRow().id,
    );
  });

  it('hashes the canonical JSON of the signed record (key order does not matter)', async () => {
    expect(await recordHash({ b: 1, a: 'x' })).toBe(await recordHash({ a: 'x', b: 1 }));
    expect(await recordHash({})).toBe(
      // SHA-256 of "{}"
      '44136fa355b3678a1146ad16f7e8649e94fb4fc21fe77e8310c060f61caaff8a',
    );
  });
});

describe('typed helpers', () => {
  it('record the command they are named for', async () => {
    const { changesOver } = await import('./changes');
    const changes = changesOver((name, args) => mutate(db, name, args));
    const entry = await changes.updateCustomer({ id: aCustomerRow().id, notes: 'Gate code 4412' });
    expect(entry).toMatchObject({ name: 'customer.update', args: { notes: 'Gate code 4412' } });
  });
});
