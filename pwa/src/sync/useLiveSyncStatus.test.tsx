// Live queries only run where the browser has a global indexedDB: give the test one first.
import 'fake-indexeddb/auto';
import { act, cleanup, renderHook, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { badgeFor } from '../features/shell/components/SyncBadge';
import type { LocalDb } from '../db/localDb';
import { mutate } from '../db/mutate';
import { aCustomerRow, freshIndexedDb, openTestDb, T0 } from '../test/localDb';
import { lastSavedWords, syncSummary } from './components/SyncSheet';
import type { SyncStatusView } from './context';
import { SyncEngine } from './engine';
import { useLiveSyncStatus } from './useLiveSyncStatus';

let db: LocalDb;
afterEach(() => {
  cleanup();
  db?.close();
});

/** An engine that is never started: only its state is read. */
function idleEngine(target: LocalDb): SyncEngine {
  const never = () => Promise.reject(new Error('not started'));
  return new SyncEngine({
    db: target,
    transport: { push: never, pull: never, putBlob: never },
    lock: (work) => work(),
  });
}

describe('useLiveSyncStatus', () => {
  it('counts what waits and lists what was refused, live as the outbox changes', async () => {
    db = openTestDb(freshIndexedDb(), undefined, { now: () => T0 });
    await db.rows('customers').put(aCustomerRow());
    const engine = idleEngine(db);
    const { result } = renderHook(() => useLiveSyncStatus(db, engine));
    await waitFor(() => expect(result.current.state).toBe('saved'));

    await act(async () => {
      await mutate(db, 'customer.update', { id: aCustomerRow().id, notes: 'Side gate' });
      await mutate(db, 'customer.update', { id: aCustomerRow().id, notes: 'Back gate' });
    });
    await waitFor(() => expect(result.current).toMatchObject({ state: 'waiting', pending: 2 }));

    await act(async () => {
      await db.rejected.add({
        id: 1,
        name: 'customer.update',
        args: {},
        createdAt: new Date(T0).toISOString(),
        code: 'forbidden',
        message: 'Only the owner may change customers',
        rejectedAt: new Date(T0).toISOString(),
      });
    });
    await waitFor(() => expect(result.current.state).toBe('needs-look'));
    expect(result.current.rejected[0]?.message).toBe('Only the owner may change customers');
  });
});

const view = (over: Partial<SyncStatusView>): SyncStatusView => ({
  state: 'saved',
  pending: 0,
  waitingImages: 0,
  rejected: [],
  lastSyncAt: null,
  online: true,
  syncing: false,
  lastError: null,
  ...over,
});

describe('sync words', () => {
  it('says the badge in words: all saved, waiting to send, needs a look', () => {
    expect(badgeFor(view({})).words).toBe('All saved');
    expect(badgeFor(view({ state: 'waiting', pending: 3 })).words).toBe('3 waiting to send');
    expect(badgeFor(view({ state: 'waiting', pending: 3, serverAway: true })).words).toBe(
      '3 waiting, server unreachable',
    );
    // Nothing waits: all is saved even while the server is away.
    expect(badgeFor(view({ serverAway: true })).words).toBe('All saved');
    const one = view({ state: 'needs-look', rejected: [{} as SyncStatusView['rejected'][number]] });
    expect(badgeFor(one).words).toBe('1 needs a look');
  });

  it('tells the detailer that changes wait on the phone while there is no signal', () => {
    expect(syncSummary(view({ state: 'waiting', pending: 2, online: false })).words).toBe(
      'No signal: 2 changes wait on this phone. They go as soon as there is a signal.',
    );
  });

  it('says when the phone last reached the server', () => {
    const at = new Date(2025, 4, 2, 14, 2).getTime();
    expect(lastSavedWords(at, at + 60_000)).toMatch(/^Last saved to the server at /);
    expect(lastSavedWords(at, at + 3 * 86_400_000)).toMatch(/^Last saved to the server on /);
    expect(lastSavedWords(null)).toBe('Not saved to the server from this phone yet.');
  });
});
