import { IDBFactory, IDBKeyRange } from 'fake-indexeddb';
import type { CustomerRow, VehicleRow } from '@panelpass/shared';
import { LocalDb, type DbOwner } from '../db/localDb';

export const anOwner: DbOwner = { userId: 'u-owner', businessId: 'b-heronwake', role: 'owner' };
export const aHelper: DbOwner = { userId: 'u-helper', businessId: 'b-heronwake', role: 'tech' };

/** A fresh, empty IndexedDB (fake-indexeddb): one per test keeps tests apart. */
export function freshIndexedDb(): IDBFactory {
  return new IDBFactory();
}

/**
 * The phone's database on a fake IndexedDB. Opening a second one on the same factory is what
 * the app does after a reload (or a crash): same name, same stored data.
 */
export function openTestDb(
  factory: IDBFactory,
  owner: DbOwner = anOwner,
  options: { now?: () => number; upToVersion?: number; onVersionChange?: () => void } = {},
): LocalDb {
  return new LocalDb(owner, {
    indexedDB: factory,
    IDBKeyRange,
    onVersionChange: options.onVersionChange ?? (() => undefined),
    ...(options.now ? { now: options.now } : {}),
    ...(options.upToVersion ? { upToVersion: options.upToVersion } : {}),
  });
}

export const T0 = Date.parse('2025-05-02T08:00:00.000Z');

/** A customer row as the server sends it. */
export function aCustomerRow(overrides: Partial<CustomerRow> = {}): CustomerRow {
  return {
    id: 'c0f5a0de-3b8e-4d4a-9b61-3f0c2a7d1e01',
    businessId: anOwner.businessId,
    version: 1,
    createdAt: '2025-05-01T10:00:00.000Z',
    updatedAt: '2025-05-01T10:00:00.000Z',
    deletedAt: null,
    name: 'Ines Marlowe',
    email: 'ines@marlowe.example',
    phone: '0700 900 111',
    address: '8 Larkspur Close',
    lat: null,
    lng: null,
    notes: '',
    ...overrides,
  };
}

export function aVehicleRow(overrides: Partial<VehicleRow> = {}): VehicleRow {
  return {
    id: 'a1d2c3b4-5e6f-4a7b-8c9d-0e1f2a3b4c5d',
    businessId: anOwner.businessId,
    version: 2,
    createdAt: '2025-05-01T10:00:00.000Z',
    updatedAt: '2025-05-01T10:00:00.000Z',
    deletedAt: null,
    customerId: aCustomerRow().id,
    make: 'Orvane',
    model: 'Tessel',
    year: 2019,
    bodyStyle: 'hatchback',
    colour: 'Slate blue',
    paintNotes: '',
    plate: null,
    ...overrides,
  };
}
