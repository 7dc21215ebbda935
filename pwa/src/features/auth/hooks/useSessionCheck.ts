import { useQuery } from '@tanstack/react-query';
import { useEffect } from 'react';
import { apiClient, sessionStore } from '../../../app/services';
import { useAfterStart } from '../../../app/useAfterStart';
import { currentUserQuery } from '../api/authApi';
import { useSession } from './useSession';

/**
 * Checks the kept session's user against the server (a role or business name may have
 * changed) once the first screen is up, and keeps what the server says. Screens read the user
 * from the session (`useCurrentUser`), so only a real change renders them again.
 */
export function useSessionCheck(): void {
  const userId = useSession()?.user.id ?? '';
  const afterStart = useAfterStart();
  const { data } = useQuery({
    ...currentUserQuery(apiClient, userId),
    enabled: userId !== '' && afterStart,
  });

  useEffect(() => {
    if (data && data.id === sessionStore.get()?.user.id) sessionStore.updateUser(data);
  }, [data]);
}
