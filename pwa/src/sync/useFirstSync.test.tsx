// Live queries need a global indexedDB: give the test one first.
import 'fake-indexeddb/auto';
import { cleanup, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { LocalDb } from '../db/localDb';
import { freshIndexedDb, openTestDb, T0 } from '../test/localDb';
import { SyncActionsContext, type SyncActions } from './context';
import { useFirstSync } from './useFirstSync';

let db: LocalDb;

beforeEach(() => {
  db = openTestDb(freshIndexedDb(), undefined, { now: () => T0 });
});

afterEach(() => {
  cleanup();
  db.close();
  vi.restoreAllMocks();
});

function wrapper({ children }: { children: ReactNode }) {
  return (
    <SyncActionsContext.Provider value={{ db } as unknown as SyncActions}>
      {children}
    </SyncActionsContext.Provider>
  );
}

describe('useFirstSync: a new phone waits for its first sync instead of showing empty lists', () => {
  it('waits while the phone has never synced, and stops when the first sync has been applied', async () => {
    const { result } = renderHook(() => useFirstSync(60_000), { wrapper });
    expect(result.current).toBe('reading');
    // Read, and still never synced: waiting.
    await waitFor(() => expect(result.current).toBe('awaiting'));
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(result.current).toBe('awaiting');
    await db.setMeta('lastSyncAt', T0);
    await waitFor(() => expect(result.current).toBe('done'));
  });

  it('does not wait on a phone that has synced before', async () => {
    await db.setMeta('lastSyncAt', T0);
    const { result } = renderHook(() => useFirstSync(60_000), { wrapper });
    expect(result.current).toBe('reading');
    await waitFor(() => expect(result.current).toBe('done'));
  });

  it('does not wait offline: the screen shows what the phone holds', () => {
    vi.spyOn(navigator, 'onLine', 'get').mockReturnValue(false);
    const { result } = renderHook(() => useFirstSync(60_000), { wrapper });
    expect(result.current).toBe('done');
  });

  it('stops waiting after the longest wait even when the first sync has not come', async () => {
    const { result } = renderHook(() => useFirstSync(100), { wrapper });
    expect(result.current).not.toBe('done');
    await waitFor(() => expect(result.current).toBe('done'));
    expect(await db.getMeta('lastSyncAt')).toBeNull();
  });
});
