import { startTransition, useEffect, useState } from 'react';
import { whenIdle } from './lazySheet';

let started = false;

/**
 * False until the browser is first idle after the app started, then true for good (screens
 * mounted later get true at once). For work that can wait for the first screen, such as
 * checking the session and settings with the server: starting those requests as the tab shell
 * mounts put them in the start's longest task, and the phone's kept copies stand meanwhile.
 */
export function useAfterStart(): boolean {
  const [now, setNow] = useState(started);
  useEffect(() => {
    if (now) return;
    return whenIdle(() => {
      started = true;
      startTransition(() => setNow(true));
    });
  }, [now]);
  return now;
}

/** For tests: as if the app had just started. */
export function resetAfterStartForTests(): void {
  started = false;
}
