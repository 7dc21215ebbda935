import type { SessionUser } from '../model/session';
import { useSession } from './useSession';

/**
 * Who is signed in, from the session kept on the phone. `SessionCheck` (in the tab shell)
 * checks it against the server when there is a signal; offline, the kept copy stands.
 */
export function useCurrentUser(): SessionUser | null {
  return useSession()?.user ?? null;
}
