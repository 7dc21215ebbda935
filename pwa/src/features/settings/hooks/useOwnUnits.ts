import { useCallback, useSyncExternalStore } from 'react';
import { useSession } from '../../auth/hooks/useSession';
import { keepOwnUnits, ownUnitsKey, readOwnUnits, type OwnUnits } from '../model/ownUnits';

const CHANGED = 'panelpass-own-units-changed';

function storage(): Storage | null {
  try {
    return typeof window === 'undefined' ? null : window.localStorage;
  } catch {
    return null;
  }
}

function subscribe(onChange: () => void): () => void {
  window.addEventListener(CHANGED, onChange);
  // Another tab of the app changed them.
  window.addEventListener('storage', onChange);
  return () => {
    window.removeEventListener(CHANGED, onChange);
    window.removeEventListener('storage', onChange);
  };
}

// useSyncExternalStore needs the same object while nothing changed.
let lastText: string | null = null;
let lastUnits: OwnUnits | null = null;

function snapshot(userId: string): OwnUnits | null {
  const store = storage();
  if (!store || !userId) return null;
  const text = store.getItem(ownUnitsKey(userId));
  if (text !== lastText) {
    lastText = text;
    lastUnits = readOwnUnits(store, userId);
  }
  return lastUnits;
}

/**
 * The signed-in person's own display units on this phone (null until they choose), and a way
 * to change them. Works offline: nothing goes to the server.
 */
export function useOwnUnits(): {
  own: OwnUnits | null;
  choose: (units: OwnUnits) => boolean;
} {
  const userId = useSession()?.user.id ?? '';
  const own = useSyncExternalStore(subscribe, () => snapshot(userId));
  const choose = useCallback(
    (units: OwnUnits) => {
      const store = storage();
      const kept = store !== null && userId !== '' && keepOwnUnits(store, userId, units);
      window.dispatchEvent(new Event(CHANGED));
      return kept;
    },
    [userId],
  );
  return { own, choose };
}
