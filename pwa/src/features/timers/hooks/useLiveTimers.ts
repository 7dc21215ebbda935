import { useLiveQuery } from 'dexie-react-hooks';
import type { TimerRow } from '@panelpass/shared';
import { useLocalDb } from '../../../db/hooks';
import { isLive } from '../model/timerWords';

/**
 * Every timer still on screen, across all jobs (live): running, paused, or ended and not yet
 * acknowledged. Undefined while loading.
 */
export function useLiveTimers(): TimerRow[] | undefined {
  const db = useLocalDb();
  return useLiveQuery(async () => {
    if (!db) return [];
    const all = await db.rows('timers').orderBy('endsAt').toArray();
    return all.filter(isLive);
  }, [db]);
}
