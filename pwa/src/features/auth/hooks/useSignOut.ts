import { useCallback } from 'react';
import { queryClient } from '../../../app/queryClient';
import { apiClient, sessionStore } from '../../../app/services';
import { signOut } from '../api/authApi';

/**
 * Signs out on this phone at once; tells the server too when there is a signal. Without one
 * the refresh token simply expires on the server.
 */
export function useSignOut(): () => Promise<void> {
  return useCallback(async () => {
    const session = sessionStore.get();
    if (session) {
      try {
        await signOut(apiClient, session.refreshToken);
      } catch {
        // Offline or already ended: signing out here must not depend on it.
      }
    }
    queryClient.clear();
    sessionStore.set(null);
  }, []);
}
