import { useLiveQuery } from 'dexie-react-hooks';
import { useSyncExternalStore } from 'react';
import type { LocalDb } from '../db/localDb';
import { statusState, type SyncStatusView } from './context';
import type { SyncEngine, SyncEngineState } from './engine';

function subscribeOnline(listener: () => void): () => void {
  window.addEventListener('online', listener);
  window.addEventListener('offline', listener);
  return () => {
    window.removeEventListener('online', listener);
    window.removeEventListener('offline', listener);
  };
}

const isOnline = () => navigator.onLine;

/**
 * The sync state, live: counts and rejections from Dexie (useLiveQuery re-runs when the
 * outbox, the rejected list, the images or meta change — in this tab or another), online
 * from the browser, syncing and the last error from the engine. Without a database yet (the
 * moment before it is opened), nothing is counted.
 */
export function useLiveSyncStatus(db: LocalDb | null, engine: SyncEngine): SyncStatusView {
  const stored = useLiveQuery(
    async () =>
      db && {
        pending: await db.outbox.count(),
        waitingImages: await db.blobs.where('state').equals('pending').count(),
        rejected: await db.rejected.orderBy('id').toArray(),
        lastSyncAt: await db.getMeta('lastSyncAt'),
      },
    [db],
  );
  const online = useSyncExternalStore(subscribeOnline, isOnline);
  const run: SyncEngineState = useSyncExternalStore(engine.subscribe, engine.getState);
  const pending = stored?.pending ?? 0;
  const rejected = stored?.rejected ?? [];
  return {
    state: statusState(pending, rejected.length),
    pending,
    waitingImages: stored?.waitingImages ?? 0,
    rejected,
    lastSyncAt: stored?.lastSyncAt ?? null,
    online,
    syncing: run.syncing,
    lastError: run.lastError,
    serverAway: run.serverAway,
  };
}
