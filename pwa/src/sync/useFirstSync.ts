import { useLiveQuery } from 'dexie-react-hooks';
import { useEffect, useState } from 'react';
import { useLocalDb } from '../db/hooks';

/**
 * Where this phone stands with its first sync, for a screen that should not show empty lists
 * ("no visits today") that fill a moment later and push everything down:
 * - `reading`: the phone's record of its last sync is still being read;
 * - `awaiting`: it has never finished a sync (a new phone, or its data just forgotten) and the
 *   first one may be on its way: online, for at most `maxWaitMs`;
 * - `done`: it has synced, or is offline, or the wait is over: show what the phone holds.
 * Only changes of the answer render again, not each sync.
 */
export type FirstSync = 'reading' | 'awaiting' | 'done';

export function useFirstSync(maxWaitMs = 10_000): FirstSync {
  const db = useLocalDb();
  const synced = useLiveQuery(
    async () => (db ? (await db.getMeta('lastSyncAt')) !== null : true),
    [db],
  );
  const [waited, setWaited] = useState(false);
  useEffect(() => {
    const timer = setTimeout(() => setWaited(true), maxWaitMs);
    return () => clearTimeout(timer);
  }, [maxWaitMs]);
  const online = typeof navigator === 'undefined' || navigator.onLine;
  if (synced === true || !online || waited) return 'done';
  return synced === undefined ? 'reading' : 'awaiting';
}
