import { useLiveQuery } from 'dexie-react-hooks';
import { useEffect, useState } from 'react';
import { useLocalDb } from '../../../db/hooks';

/** Server clock minus this phone's clock, as the last sync measured it (0 until then). */
export function useServerOffset(): number {
  const db = useLocalDb();
  return useLiveQuery(async () => (db ? db.getMeta('serverOffsetMs') : 0), [db]) ?? 0;
}

/**
 * Now on the server's clock, for screens that show time left. It re-renders every `tickMs`
 * while the app is on screen (null: never) so the figure moves, and at once when the app
 * comes back; the figure itself is always end − now, never a count of ticks.
 */
export function useServerNow(tickMs: number | null = 1000): number {
  const offset = useServerOffset();
  const [phoneNow, setPhoneNow] = useState(() => Date.now());
  useEffect(() => {
    const tick = () => setPhoneNow(Date.now());
    let interval: number | undefined;
    const start = () => {
      window.clearInterval(interval);
      interval = undefined;
      if (tickMs !== null && document.visibilityState === 'visible') {
        interval = window.setInterval(tick, tickMs);
      }
    };
    const onVisibility = () => {
      tick();
      start();
    };
    start();
    document.addEventListener('visibilitychange', onVisibility);
    return () => {
      window.clearInterval(interval);
      document.removeEventListener('visibilitychange', onVisibility);
    };
  }, [tickMs]);
  return phoneNow + offset;
}
