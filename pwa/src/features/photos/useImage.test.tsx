// Live queries only run where the browser has a global indexedDB: give the test one first.
import 'fake-indexeddb/auto';
import { cleanup, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { sha256Hex } from '../../db/images';
import type { LocalDb } from '../../db/localDb';
import { SyncActionsContext, SyncContext, type SyncContextValue } from '../../sync/context';
import { freshIndexedDb, openTestDb, T0 } from '../../test/localDb';
import { useImage } from './usePhotos';

let db: LocalDb;
const fetchSpy = vi.fn<typeof fetch>(() => Promise.reject(new Error('no server in this test')));

beforeEach(() => {
  db = openTestDb(freshIndexedDb(), undefined, { now: () => T0 });
  vi.stubGlobal('fetch', fetchSpy);
  // jsdom has no object URLs: a stand-in that says which bytes it was made from.
  URL.createObjectURL = vi.fn((blob: Blob) => `blob:test/${blob.size}`);
  URL.revokeObjectURL = vi.fn();
});

afterEach(() => {
  cleanup();
  db.close();
  fetchSpy.mockClear();
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

function wrapper({ children }: { children: ReactNode }) {
  return (
    <SyncActionsContext.Provider value={{ db } as unknown as SyncContextValue}>
      <SyncContext.Provider value={{ db } as unknown as SyncContextValue}>
        {children}
      </SyncContext.Provider>
    </SyncActionsContext.Provider>
  );
}

describe('useImage: an image by its SHA-256 on this phone', () => {
  it('shows the copy the phone holds, without asking the server', async () => {
    const data = new Uint8Array([9, 8, 7, 6]).buffer;
    const sha = await sha256Hex(data);
    await db.blobs.add({
      sha256: sha,
      mime: 'image/jpeg',
      data,
      size: 4,
      state: 'uploaded',
      tries: 0,
      lastError: null,
      createdAt: new Date(T0).toISOString(),
    });
    const { result } = renderHook(() => useImage(sha), { wrapper });
    await waitFor(() => expect(result.current).toEqual({ status: 'ready', url: 'blob:test/4' }));
    expect(fetchSpy).not.toHaveBeenCalled();
  });

  it('says offline, and does not try, when the phone has no signal and no copy', async () => {
    vi.spyOn(navigator, 'onLine', 'get').mockReturnValue(false);
    const { result } = renderHook(() => useImage('ab'.repeat(32)), { wrapper });
    await waitFor(() => expect(result.current.status).toBe('offline'));
    expect(result.current.url).toBeNull();
    expect(fetchSpy).not.toHaveBeenCalled();
  });
});
