import { afterEach, describe, expect, it, vi } from 'vitest';
import { SYNC_TABLES } from '@panelpass/shared';
import { aCustomerRow, freshIndexedDb, openTestDb } from '../test/localDb';
import type { LocalDb } from './localDb';
import { SCHEMA_VERSIONS } from './schema';

const opened: LocalDb[] = [];
function track(db: LocalDb): LocalDb {
  opened.push(db);
  return db;
}
afterEach(() => {
  for (const db of opened.splice(0)) db.close();
});

describe('Dexie schema', () => {
  it('keeps version 1 exactly as shipped (versions are append-only)', () => {
    // Phones in the field hold data in this shape. Change the schema by adding a version.
    expect(SCHEMA_VERSIONS[0]).toEqual({
      version: 1,
      stores: {
        customers: 'id, name',
        vehicles: 'id, customerId',
        products: 'id, kind',
        quotes: 'id, customerId',
        quote_lines: 'id, quoteId',
        jobs: 'id, windowStart, customerId, vehicleId, assignedTechId',
        job_panels: 'id, jobId, [jobId+position]',
        checklist_items: 'id, jobId, [jobId+position]',
        damage_pins: 'id, jobId',
        film_readings: 'id, jobId, panelId',
        correction_passes: 'id, jobId, panelId',
        chips: 'id, jobId, panelId',
        chip_layers: 'id, jobId, chipId',
        solvent_applications: 'id, jobId',
        masking_items: 'id, jobId',
        timers: 'id, jobId, subjectId',
        climate_readings: 'id, jobId, takenAt',
        photos: 'id, jobId, vehicleId, subjectId, sha256',
        signatures: 'id, jobId, quoteId',
        payments: 'id, jobId, opId',
        invoices: 'id, jobId',
        stock_movements: 'id, productId, jobId',
        outbox: 'id',
        rejected: 'id',
        meta: 'key',
        blobs: 'sha256, state',
        base: 'key',
      },
    });
  });

  it('numbers the versions 1, 2, 3… in order', () => {
    expect(SCHEMA_VERSIONS.map((v) => v.version)).toEqual(SCHEMA_VERSIONS.map((_, i) => i + 1));
  });

  it('has a table for every synced table of the protocol', async () => {
    const db = track(openTestDb(freshIndexedDb()));
    await db.open();
    const names = db.tables.map((t) => t.name);
    for (const table of SYNC_TABLES) expect(names).toContain(table);
  });

  it('upgrades a version-1 database to the latest, keeping rows, outbox and meta', async () => {
    const factory = freshIndexedDb();
    const old = openTestDb(factory, undefined, { upToVersion: 1 });
    await old.open();
    expect(old.verno).toBe(1);
    const clientId = await old.getMeta('clientId');
    await old.rows('customers').put(aCustomerRow());
    await old.rows('timers').put({
      id: 't-1',
      businessId: 'b-heronwake',
      version: 4,
      createdAt: '2025-05-02T08:00:00.000Z',
      updatedAt: '2025-05-02T08:00:00.000Z',
      deletedAt: null,
      jobId: null,
      kind: 'cure',
      subjectType: null,
      subjectId: null,
      label: 'Touch-up layer 2',
      startedAt: '2025-05-02T08:00:00.000Z',
      endsAt: '2025-05-02T08:30:00.000Z',
      pausedMs: 0,
      pausedAt: null,
      acknowledgedAt: null,
      cancelledAt: null,
      startedBy: 'u-owner',
    });
    await old.outbox.add({ id: 1, name: 'timer.ack', args: { id: 't-1' }, createdAt: '', at: 0 });
    old.close();

    const latest = track(openTestDb(factory));
    await latest.open();
    expect(latest.verno).toBe(SCHEMA_VERSIONS.length);
    expect(await latest.getMeta('clientId')).toBe(clientId);
    expect(await latest.rows('customers').get(aCustomerRow().id)).toEqual(aCustomerRow());
    expect(await latest.outbox.count()).toBe(1);
    // The index version 2 added works on rows written under version 1.
    const due = await latest
      .rows('timers')
      .where('endsAt')
      .below('2025-05-02T09:00:00.000Z')
      .primaryKeys();
    expect(due).toEqual(['t-1']);
  });

  it('closes and hands over when another tab opens a newer version', async () => {
    const factory = freshIndexedDb();
    const onVersionChange = vi.fn();
    const old = track(openTestDb(factory, undefined, { upToVersion: 1, onVersionChange }));
    await old.open();
    const newer = track(openTestDb(factory));
    // Would hang (blocked) if the old connection stayed open.
    await newer.open();
    expect(onVersionChange).toHaveBeenCalledTimes(1);
    expect(old.isOpen()).toBe(false);
    expect(newer.verno).toBe(SCHEMA_VERSIONS.length);
  });
});
