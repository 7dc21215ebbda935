import { useLiveQuery } from 'dexie-react-hooks';
import { useEffect, useState } from 'react';
import { useLocalDb } from '../db/hooks';

/**
 * True while this phone has never finished a sync (a new phone, or its data just forgotten) and
 * the first one may be on its way: online, for at most `maxWaitMs`. A screen then says its work
 * is coming instead of showing empty lists ("no visits today") that fill a moment later and push
 * everything down. Offline, or once the wait is over, the screen shows what the phone holds.
 * Only changes of the answer render again, not each sync.
 */
export function useAwaitingFirstSync(maxWaitMs = 10_000): boolean {
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
  // Still reading the answer counts as waiting: the screen appears once, not twice.
  return synced !== true && online && !waited;
}
