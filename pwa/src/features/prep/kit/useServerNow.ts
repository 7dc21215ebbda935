import { useLiveQuery } from 'dexie-react-hooks';
import { useEffect, useState } from 'react';
import { useLocalDb } from '../../../db/hooks';

/**
 * Now on the server's clock (the phone's clock plus the offset the last sync measured),
 * refreshed every `tickMs`. Deadlines are absolute times, so a countdown computed from this
 * stays right after the phone sleeps: nothing counts ticks.
 */
export function useServerNow(tickMs = 1000): number {
  const db = useLocalDb();
  const offset = useLiveQuery(async () => (db ? db.getMeta('serverOffsetMs') : 0), [db]) ?? 0;
  const [phoneNow, setPhoneNow] = useState(() => Date.now());
  useEffect(() => {
    const tick = () => setPhoneNow(Date.now());
    const timer = window.setInterval(tick, tickMs);
    // Coming back to the app after the phone slept: show the right time at once.
    const onVisible = () => {
      if (document.visibilityState === 'visible') tick();
    };
    document.addEventListener('visibilitychange', onVisible);
    return () => {
      window.clearInterval(timer);
      document.removeEventListener('visibilitychange', onVisible);
    };
  }, [tickMs]);
  return phoneNow + offset;
}
