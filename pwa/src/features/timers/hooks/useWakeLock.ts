import { useCallback, useEffect, useState, useSyncExternalStore } from 'react';

const KEY = 'panelpass-keep-screen-on';
const listeners = new Set<() => void>();

function readWanted(): boolean {
  try {
    return window.localStorage.getItem(KEY) === 'yes';
  } catch {
    return false;
  }
}

export function wakeLockSupported(): boolean {
  return typeof navigator !== 'undefined' && 'wakeLock' in navigator;
}

/** The person's choice, kept on the phone: keep the screen on while a timer runs. */
export function useKeepScreenOn(): [boolean, (on: boolean) => void] {
  const wanted = useSyncExternalStore(
    (notify) => {
      listeners.add(notify);
      return () => listeners.delete(notify);
    },
    readWanted,
    () => false,
  );
  const set = useCallback((on: boolean) => {
    try {
      window.localStorage.setItem(KEY, on ? 'yes' : 'no');
    } catch {
      // Not kept across reloads; it still applies now.
    }
    listeners.forEach((l) => l());
  }, []);
  return [wanted, set];
}

/**
 * Holds a screen wake lock while `active` (the person asked for it and a timer runs), and
 * lets it go when no timer runs. The browser drops the lock whenever the app is hidden, so it
 * is taken again when the app comes back. Answers whether the lock is held now.
 */
export function useWakeLock(active: boolean): boolean {
  const [held, setHeld] = useState(false);
  useEffect(() => {
    if (!active || !wakeLockSupported()) return;
    let sentinel: WakeLockSentinel | null = null;
    let stopped = false;
    const take = async () => {
      if (document.visibilityState !== 'visible' || (sentinel && !sentinel.released)) return;
      try {
        const lock = await navigator.wakeLock.request('screen');
        if (stopped) {
          void lock.release();
          return;
        }
        sentinel = lock;
        setHeld(true);
        lock.addEventListener('release', () => setHeld(false));
      } catch {
        // Refused (battery saver, not allowed here): the screen sleeps as usual.
        setHeld(false);
      }
    };
    const onVisibility = () => void take();
    void take();
    document.addEventListener('visibilitychange', onVisibility);
    return () => {
      stopped = true;
      document.removeEventListener('visibilitychange', onVisibility);
      void sentinel?.release().catch(() => undefined);
      setHeld(false);
    };
  }, [active]);
  return held;
}
