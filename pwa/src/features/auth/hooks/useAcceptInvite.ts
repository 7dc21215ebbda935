import { queryClient } from '../../../app/queryClient';
import { apiClient } from '../../../app/services';
import { acceptInvite, type AcceptInviteInput } from '../api/authApi';
import type { Session } from '../model/session';
import { useStartSession } from './useStartSession';

async function request(input: AcceptInviteInput): Promise<Session> {
  const session = await acceptInvite(apiClient, input);
  // Whoever was signed in on this phone before is not the person who accepted.
  queryClient.clear();
  return session;
}

/** A helper accepts an invite link, sets a password, and is signed in as that helper. */
export function useAcceptInvite(onAccepted: (session: Session) => void) {
  return useStartSession(request, onAccepted);
}
