import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { PULL_PAGE_ROWS } from '@panelpass/shared';
import { createApiClient } from '../api/client';
import { NetworkError } from '../api/errors';
import { createSessionStore } from '../features/auth/model/sessionStore';
import { attachPhoto, sha256Hex } from '../db/images';
import type { DbOwner, LocalDb } from '../db/localDb';
import { mutate } from '../db/mutate';
import { FakeSyncServer } from '../test/fakeSyncServer';
import {
  aCustomerRow,
  aHelper,
  anOwner,
  aVehicleRow,
  freshIndexedDb,
  openTestDb,
  T0,
} from '../test/localDb';
import { MemoryStorage } from '../test/memoryStorage';
import { aSession } from '../test/sessions';
import { badgeFor } from '../features/shell/components/SyncBadge';
import { SERVER_AWAY_WORDS, SyncEngine, type SyncLock } from './engine';
import { createHttpTransport, type SyncTransport } from './transport';

const noLock: SyncLock = (work) => work();

function transportFor(server: FakeSyncServer): SyncTransport {
  const sessionStore = createSessionStore(new MemoryStorage());
  sessionStore.set(aSession());
  const api = createApiClient({ sessionStore, fetch: server.fetch, lock: (w) => w() });
  return createHttpTransport({ api, sessionStore, fetch: server.fetch });
}

/** An engine that only runs when told (no events, no timers firing in these tests). */
function engineFor(
  db: LocalDb,
  transport: SyncTransport,
  extra: Partial<ConstructorParameters<typeof SyncEngine>[0]> = {},
) {
  return new SyncEngine({ db, transport, lock: noLock, isOnline: () => true, ...extra });
}

const open: LocalDb[] = [];
const engines: SyncEngine[] = [];
function phone(factory: IDBFactory, owner: DbOwner = anOwner, now = () => T0): LocalDb {
  const db = openTestDb(factory, owner, { now });
  open.push(db);
  return db;
}

let server: FakeSyncServer;
beforeEach(() => {
  server = new FakeSyncServer(anOwner);
  server.seed('customers', aCustomerRow());
  server.seed('vehicles', aVehicleRow());
});
afterEach(async () => {
  for (const e of engines.splice(0)) await e.stop();
  for (const db of open.splice(0)) db.close();
  vi.useRealTimers();
});

/** Lets IndexedDB work (setImmediate, not faked) finish until the engine has scheduled its next try. */
async function settled(engine: SyncEngine): Promise<void> {
  for (let i = 0; i < 1_000; i++) {
    const { syncing, nextAttemptAt } = engine.getState();
    if (!syncing && nextAttemptAt !== null) return;
    await new Promise((resolve) => setImmediate(resolve));
  }
  throw new Error('The engine did not settle');
}

const ids = {
  a: '11111111-1111-4111-8111-111111111111',
  b: '22222222-2222-4222-8222-222222222222',
  c: '33333333-3333-4333-8333-333333333333',
};

describe('SyncEngine', () => {
  it('pushes the outbox, pulls, and two phones end up holding the same rows', async () => {
    const ownerPhone = phone(freshIndexedDb());
    const helperPhone = phone(freshIndexedDb(), { ...aHelper, role: 'owner' });
    const one = engineFor(ownerPhone, transportFor(server));
    const two = engineFor(helperPhone, transportFor(server));
    engines.push(one, two);
    await one.syncNow();

    await mutate(ownerPhone, 'customer.create', { id: ids.a, name: 'Tamsin Vale' });
    await mutate(ownerPhone, 'customer.update', { id: aCustomerRow().id, notes: 'Side gate' });
    expect(await one.syncNow()).toBe(true);
    expect(await two.syncNow()).toBe(true);
    await mutate(helperPhone, 'customer.update', { id: ids.a, phone: '0700 555' });
    expect(await two.syncNow()).toBe(true);
    expect(await one.syncNow()).toBe(true);

    expect(await ownerPhone.outbox.count()).toBe(0);
    expect(await helperPhone.outbox.count()).toBe(0);
    const onServer = server.live('customers');
    expect(await ownerPhone.rows('customers').orderBy('id').toArray()).toEqual(onServer);
    expect(await helperPhone.rows('customers').orderBy('id').toArray()).toEqual(onServer);
    expect(server.row('customers', ids.a)).toMatchObject({
      name: 'Tamsin Vale',
      phone: '0700 555',
    });
    expect(await ownerPhone.getMeta('lastSyncAt')).toBe(server.now());
  });

  it('does not apply a mutation twice when the answer to a push is lost', async () => {
    const db = phone(freshIndexedDb());
    const engine = engineFor(db, transportFor(server));
    engines.push(engine);
    await mutate(db, 'customer.create', { id: ids.a, name: 'Tamsin Vale' });
    await mutate(db, 'customer.create', { id: ids.b, name: 'Perrin Ash' });

    server.failNext('push', 'lost-answer');
    expect(await engine.syncNow()).toBe(false);
    expect(server.applied).toHaveLength(2);
    expect(await db.outbox.count()).toBe(2);
    // The phone had a signal; the server did not answer.
    expect(engine.getState()).toMatchObject({ lastError: SERVER_AWAY_WORDS, serverAway: true });

    expect(await engine.syncNow()).toBe(true);
    const clientId = await db.getMeta('clientId');
    expect(server.applied).toEqual([
      `${clientId}:1 customer.create`,
      `${clientId}:2 customer.create`,
    ]);
    expect(await db.outbox.count()).toBe(0);
    expect(server.live('customers')).toHaveLength(3);
  });

  it('records what the server refused, with its reason, and undoes its effect', async () => {
    const db = phone(freshIndexedDb());
    const engine = engineFor(db, transportFor(server));
    engines.push(engine);
    await engine.syncNow();
    server.refuse = (m) =>
      m.name === 'customer.create'
        ? { code: 'validation-failed', message: 'email must be an e-mail address' }
        : null;
    await mutate(db, 'customer.create', { id: ids.a, name: 'Tamsin Vale', email: 'tamsin' });
    await mutate(db, 'customer.update', { id: aCustomerRow().id, notes: 'Side gate' });
    expect(await engine.syncNow()).toBe(true);
    expect(await db.rejected.toArray()).toMatchObject([
      {
        id: 1,
        name: 'customer.create',
        code: 'validation-failed',
        message: 'email must be an e-mail address',
      },
    ]);
    expect(await db.rows('customers').get(ids.a)).toBeUndefined();
    expect((await db.rows('customers').get(aCustomerRow().id))?.notes).toBe('Side gate');
  });

  it('uploads an image before the mutation that points at it, and keeps it through a crash', async () => {
    const factory = freshIndexedDb();
    const db = phone(factory);
    await db.rows('customers').put(aCustomerRow());
    await mutate(db, 'customer.update', { id: aCustomerRow().id, notes: 'Before the photo' });
    const bytes = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 9, 8, 7, 6]);
    await attachPhoto(db, {
      id: ids.c,
      vehicleId: aVehicleRow().id,
      kind: 'before',
      data: bytes,
      mime: 'image/jpeg',
      width: 4,
      height: 2,
    });
    await mutate(db, 'customer.update', { id: aCustomerRow().id, notes: 'After the photo' });

    // No signal for the upload: the mutation before the photo goes, the photo and after wait.
    server.failNext('blob', 'down');
    const first = engineFor(db, transportFor(server));
    expect(await first.syncNow()).toBe(false);
    expect(server.calls.filter((c) => c.startsWith('push'))).toEqual(['push 1']);
    await first.stop();

    // The app is closed mid-way and opened again: the image is still on the phone.
    db.close();
    const again = phone(factory);
    const sha = await sha256Hex(bytes);
    expect(await again.blobs.get(sha)).toMatchObject({ state: 'pending', tries: 1 });
    const second = engineFor(again, transportFor(server));
    engines.push(second);
    expect(await second.syncNow()).toBe(true);

    const order = server.calls.filter((c) => !c.startsWith('pull'));
    expect(order).toEqual(['push 1', `PUT blob ${sha}`, 'push 2,3']);
    expect(server.blobs.get(sha)).toEqual({ mime: 'image/jpeg', size: 8 });
    expect(server.row('photos', ids.c)).toMatchObject({ sha256: sha, bytes: 8 });
    expect(await again.blobs.get(sha)).toMatchObject({ state: 'uploaded' });
    expect(await again.outbox.count()).toBe(0);
  });

  it('lets a refused image go on to the server, whose refusal then shows among the rejected', async () => {
    const db = phone(freshIndexedDb());
    // A transport that refuses the image for good (e.g. not JPEG/PNG/WebP after all).
    const base = transportFor(server);
    const { ApiError } = await import('../api/errors');
    const transport: SyncTransport = {
      ...base,
      putBlob: () =>
        Promise.reject(new ApiError(415, 'unsupported-image', 'Send a JPEG, PNG or WebP image')),
    };
    const engine = engineFor(db, transport);
    engines.push(engine);
    await attachPhoto(db, {
      id: ids.c,
      vehicleId: aVehicleRow().id,
      kind: 'damage',
      data: new Uint8Array([1, 2, 3]),
      mime: 'image/png',
      width: 1,
      height: 1,
    });
    expect(await engine.syncNow()).toBe(true);
    const [blob] = await db.blobs.toArray();
    expect(blob).toMatchObject({ state: 'refused', lastError: 'Send a JPEG, PNG or WebP image' });
    expect(await db.rejected.toArray()).toMatchObject([
      { name: 'photo.attach', code: 'blob-missing' },
    ]);
  });

  it('pulls page after page and applies them together', async () => {
    server.pageSize = 2;
    for (const id of [ids.a, ids.b, ids.c])
      server.seed('customers', aCustomerRow({ id, name: id.slice(0, 4) }));
    const db = phone(freshIndexedDb());
    const engine = engineFor(db, transportFor(server));
    engines.push(engine);
    expect(await engine.syncNow()).toBe(true);
    // 4 customers and a vehicle, 2 rows a page.
    expect(server.calls).toEqual(['pull 0', 'pull 2', 'pull 4']);
    // Each page asks for the app's page size.
    expect(server.pullLimits).toEqual([PULL_PAGE_ROWS, PULL_PAGE_ROWS, PULL_PAGE_ROWS]);
    expect(await db.rows('customers').count()).toBe(4);
    expect(await db.rows('vehicles').count()).toBe(1);
    expect(await db.getMeta('cursor')).toBe(5);
  });

  it("drops a job the helper was taken off when the server's scope changes", async () => {
    const jobRow = (id: string) => ({
      id,
      businessId: anOwner.businessId,
      version: 0,
      createdAt: '',
      updatedAt: '',
      deletedAt: null,
      customerId: aCustomerRow().id,
      vehicleId: 'v',
      quoteId: null,
      address: '',
      lat: null,
      lng: null,
      windowStart: '2025-05-03T09:00:00.000Z',
      windowEnd: '2025-05-03T10:00:00.000Z',
      assignedTechId: aHelper.userId,
      stage: 'booked',
      conditionNotes: '',
      notes: '',
      services: [],
    });
    server.seed('jobs', jobRow(ids.a));
    server.seed('jobs', jobRow(ids.b));
    const db = phone(freshIndexedDb(), aHelper);
    const engine = engineFor(db, transportFor(server));
    engines.push(engine);
    expect(await engine.syncNow()).toBe(true);
    expect(await db.rows('jobs').count()).toBe(2);

    server.visible = (table, row) => table !== 'jobs' || row.id === ids.b;
    server.scope += 1;
    expect(await engine.syncNow()).toBe(true);
    expect(await db.rows('jobs').toCollection().primaryKeys()).toEqual([ids.b]);
    expect(await db.getMeta('scope')).toBe(1);
  });

  it('runs one sync at a time and once more for a request made meanwhile', async () => {
    const db = phone(freshIndexedDb());
    let pushes = 0;
    let release!: () => void;
    const gate = new Promise<void>((resolve) => (release = resolve));
    const base = transportFor(server);
    const transport: SyncTransport = {
      ...base,
      push: async (body) => {
        pushes += 1;
        await gate;
        return base.push(body);
      },
    };
    const engine = engineFor(db, transport);
    engines.push(engine);
    await mutate(db, 'customer.create', { id: ids.a, name: 'Tamsin Vale' });
    const first = engine.syncNow();
    const second = engine.syncNow();
    const third = engine.syncNow();
    await vi.waitFor(() => expect(pushes).toBe(1));
    await mutate(db, 'customer.create', { id: ids.b, name: 'Perrin Ash' });
    release();
    await Promise.all([first, second, third]);
    expect(pushes).toBe(2);
    expect(server.applied).toHaveLength(2);
  });

  it('backs off exponentially after failures, up to a minute, and resets after a success', async () => {
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout', 'Date'] });
    vi.setSystemTime(T0);
    const attempts: number[] = [];
    let failing = true;
    const transport: SyncTransport = {
      push: () => Promise.reject(new NetworkError()),
      pull: async ({ cursor, scope }) => {
        attempts.push(Date.now() - T0);
        if (failing) throw new NetworkError();
        return Promise.resolve({
          cursor,
          scope,
          reset: false,
          lastMutationId: 0,
          changes: {},
          more: false,
          serverTime: Date.now(),
        });
      },
      putBlob: () => Promise.resolve(),
    };
    const db = phone(freshIndexedDb(), anOwner, () => Date.now());
    const engine = new SyncEngine({
      db,
      transport,
      lock: noLock,
      isOnline: () => true,
      random: () => 1,
      intervalMs: 30_000,
      windowTarget: new EventTarget(),
      documentTarget: Object.assign(new EventTarget(), { visibilityState: 'visible' as const }),
    });
    engines.push(engine);
    engine.start();
    await settled(engine);
    for (let i = 0; i < 7; i++) {
      await vi.advanceTimersByTimeAsync(engine.getState().nextAttemptAt! - Date.now());
      await settled(engine);
    }
    const gaps = attempts.slice(1).map((t, i) => t - attempts[i]!);
    expect(gaps).toEqual([2_000, 4_000, 8_000, 16_000, 32_000, 60_000, 60_000]);
    expect(engine.getState().failures).toBe(8);

    failing = false;
    await vi.advanceTimersByTimeAsync(60_000);
    await settled(engine);
    expect(engine.getState()).toMatchObject({ failures: 0, lastError: null });
    // All well again: the next sync comes after the regular interval.
    expect(engine.getState().nextAttemptAt! - Date.now()).toBe(30_000);
  });

  it("keeps the outbox through the server's 503 (its database away), says so in words and retries by itself", async () => {
    vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout', 'Date'] });
    vi.setSystemTime(T0);
    const db = phone(freshIndexedDb(), anOwner, () => Date.now());
    const engine = new SyncEngine({
      db,
      transport: transportFor(server),
      lock: noLock,
      isOnline: () => true,
      random: () => 1,
      windowTarget: new EventTarget(),
      documentTarget: Object.assign(new EventTarget(), { visibilityState: 'visible' as const }),
    });
    engines.push(engine);
    await mutate(db, 'customer.create', { id: ids.a, name: 'Tamsin Vale' });
    await mutate(db, 'customer.update', { id: ids.a, notes: 'Side gate' });
    server.failNext('push', 'database-down', 2);

    engine.start();
    await settled(engine);
    expect(await db.outbox.count()).toBe(2);
    expect(server.applied).toHaveLength(0);
    expect(engine.getState()).toMatchObject({
      failures: 1,
      serverAway: true,
      lastError: SERVER_AWAY_WORDS,
    });
    expect(engine.getState().nextAttemptAt! - Date.now()).toBe(2_000);
    expect(badgeFor({ state: 'waiting', pending: 2, rejected: [], serverAway: true }).words).toBe(
      '2 waiting, server unreachable',
    );

    // Still away at the first retry: kept, and the wait grows.
    await vi.advanceTimersByTimeAsync(2_000);
    await settled(engine);
    expect(await db.outbox.count()).toBe(2);
    expect(engine.getState().failures).toBe(2);
    expect(engine.getState().nextAttemptAt! - Date.now()).toBe(4_000);

    // Back: the same mutations go, once each, with no tap from the detailer.
    await vi.advanceTimersByTimeAsync(4_000);
    await settled(engine);
    expect(await db.outbox.count()).toBe(0);
    expect(server.applied).toEqual([
      expect.stringMatching(/:1 customer\.create$/),
      expect.stringMatching(/:2 customer\.update$/),
    ]);
    expect(engine.getState()).toMatchObject({ failures: 0, serverAway: false, lastError: null });
    expect(server.row('customers', ids.a)).toMatchObject({ notes: 'Side gate' });
  });

  it('syncs when the phone comes back online', async () => {
    const win = new EventTarget();
    let online = false;
    const db = phone(freshIndexedDb());
    const engine = new SyncEngine({
      db,
      transport: transportFor(server),
      lock: noLock,
      isOnline: () => online,
      windowTarget: win,
      documentTarget: Object.assign(new EventTarget(), { visibilityState: 'visible' as const }),
    });
    engines.push(engine);
    await mutate(db, 'customer.create', { id: ids.a, name: 'Tamsin Vale' });
    engine.start();
    await vi.waitFor(() => expect(engine.getState().failures).toBe(1));
    expect(server.applied).toHaveLength(0);
    online = true;
    win.dispatchEvent(new Event('online'));
    await vi.waitFor(async () => expect(await db.outbox.count()).toBe(0));
    expect(server.applied).toHaveLength(1);
  });
});
