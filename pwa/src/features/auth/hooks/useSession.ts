import { useSyncExternalStore } from 'react';
import { sessionStore } from '../../../app/services';
import type { Session } from '../model/session';

/** The signed-in session (null when signed out); re-renders when it changes. */
export function useSession(): Session | null {
  return useSyncExternalStore(sessionStore.subscribe, sessionStore.get);
}
