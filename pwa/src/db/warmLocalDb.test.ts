import { IDBFactory } from 'fake-indexeddb';
import { describe, expect, it } from 'vitest';
import { localDbName } from './localDbName';
import { warmLocalDb } from './warmLocalDb';

function open(idb: IDBFactory, name: string, version?: number): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const request = version === undefined ? idb.open(name) : idb.open(name, version);
    request.onupgradeneeded = () => request.result.createObjectStore(`store-${version ?? 1}`);
    request.onsuccess = () => resolve(request.result);
    request.onerror = () => reject(request.error ?? new Error('open failed'));
    request.onblocked = () => reject(new Error('blocked'));
  });
}

describe('warmLocalDb', () => {
  it('creates nothing for a user with no database on the phone', async () => {
    const idb = new IDBFactory();
    await expect(warmLocalDb('user-1', { idb })).resolves.toBe(false);
    expect(await idb.databases()).toEqual([]);
  });

  it("opens the user's database as it is, and gives way to an upgrade at once", async () => {
    const idb = new IDBFactory();
    (await open(idb, localDbName('user-1'), 20)).close();
    await expect(warmLocalDb('user-1', { idb, holdMs: 60_000 })).resolves.toBe(true);
    expect(await idb.databases()).toEqual([{ name: localDbName('user-1'), version: 20 }]);
    // A newer app opening a newer version is not blocked by the warm-up's connection.
    const upgraded = await open(idb, localDbName('user-1'), 30);
    expect(upgraded.version).toBe(30);
    upgraded.close();
  });
});
