import Dexie from 'dexie';
import { IDBKeyRange } from 'fake-indexeddb';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { SYNC_TABLES } from '@panelpass/shared';
import { aCustomerRow, freshIndexedDb, openTestDb } from '../test/localDb';
import { declareSchema, type LocalDb } from './localDb';
import { SCHEMA_VERSIONS, type SchemaVersion } from './schema';

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

  describe('declareSchema', () => {
    // A schema's history as the list keeps it: v2 rewrites rows, v3 and v4 only add indexes.
    const history: SchemaVersion[] = [
      { version: 1, stores: { notes: 'id', meta: 'key' } },
      {
        version: 2,
        stores: { notes: 'id, title' },
        upgrade: async (tx) => {
          await tx
            .table('notes')
            .toCollection()
            .modify((n: { text?: string; title?: string }) => {
              n.title = n.text?.split(' ')[0];
            });
        },
      },
      { version: 3, stores: { notes: 'id, title, pinned' } },
      { version: 4, stores: { tags: 'id' } },
    ];
    const dexieOn = (factory: IDBFactory, versions: SchemaVersion[]) => {
      const db = new Dexie('schema-test', { indexedDB: factory, IDBKeyRange });
      declareSchema(db, versions);
      return db;
    };

    it('declares the merged latest schema and, before it, only the versions that rewrite rows', () => {
      const declared: { version: number; stores: unknown; upgrade: boolean }[] = [];
      const recorder = {
        version: (version: number) => ({
          stores: (stores: unknown) => {
            const entry = { version, stores, upgrade: false };
            declared.push(entry);
            return {
              upgrade: () => {
                entry.upgrade = true;
              },
            };
          },
        }),
      } as unknown as Dexie;
      declareSchema(recorder, history);
      expect(declared).toEqual([
        { version: 2, stores: { notes: 'id, title', meta: 'key' }, upgrade: true },
        {
          version: 4,
          stores: { notes: 'id, title, pinned', meta: 'key', tags: 'id' },
          upgrade: false,
        },
      ]);
    });

    it('upgrades a database from its first version: rows rewritten, later indexes and stores there', async () => {
      const factory = freshIndexedDb();
      const first = dexieOn(factory, history.slice(0, 1));
      await first.table('notes').put({ id: 'n1', text: 'Bonnet swirls', pinned: 'yes' });
      first.close();

      const latest = dexieOn(factory, history);
      await latest.open();
      expect(latest.verno).toBe(4);
      expect(await latest.table('notes').where('title').equals('Bonnet').primaryKeys()).toEqual([
        'n1',
      ]);
      expect(await latest.table('notes').where('pinned').equals('yes').count()).toBe(1);
      await latest.table('tags').put({ id: 't1' });
      latest.close();
    });
  });
});
