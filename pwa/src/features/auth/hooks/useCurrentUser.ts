import { useQuery } from '@tanstack/react-query';
import { useEffect } from 'react';
import { apiClient, sessionStore } from '../../../app/services';
import { useAfterStart } from '../../../app/useAfterStart';
import { currentUserQuery } from '../api/authApi';
import { useSession } from './useSession';

/**
 * Who is signed in, from the session kept on the phone, checked against the server when
 * there is a signal (a role or business name may have changed), once the first screen is up.
 * Offline, the kept copy stands.
 */
export function useCurrentUser() {
  const session = useSession();
  const userId = session?.user.id ?? '';
  const afterStart = useAfterStart();
  const { data } = useQuery({
    ...currentUserQuery(apiClient, userId),
    enabled: userId !== '' && afterStart,
  });

  useEffect(() => {
    if (data && data.id === sessionStore.get()?.user.id) sessionStore.updateUser(data);
  }, [data]);

  return session?.user ?? null;
}
