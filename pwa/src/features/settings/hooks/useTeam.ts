import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../app/services';
import { useSession } from '../../auth/hooks/useSession';
import {
  createInvite,
  invitesQuery,
  removeMember,
  teamQuery,
  withdrawInvite,
} from '../api/businessApi';

/** The owner's team: who is on it, the invites not yet used, and the changes to both. */
export function useTeam() {
  const businessId = useSession()?.user.businessId ?? '';
  const client = useQueryClient();
  const team = useQuery({ ...teamQuery(apiClient, businessId), enabled: businessId !== '' });
  const invites = useQuery({ ...invitesQuery(apiClient, businessId), enabled: businessId !== '' });
  const refresh = () =>
    Promise.all([
      client.invalidateQueries({ queryKey: ['team', businessId] }),
      client.invalidateQueries({ queryKey: ['invites', businessId] }),
    ]);
  const invite = useMutation({
    mutationFn: (who: { email: string; name: string }) => createInvite(apiClient, who),
    onSuccess: refresh,
    networkMode: 'always',
  });
  const remove = useMutation({
    mutationFn: (userId: string) => removeMember(apiClient, userId),
    onSuccess: refresh,
    networkMode: 'always',
  });
  const withdraw = useMutation({
    mutationFn: (inviteId: string) => withdrawInvite(apiClient, inviteId),
    onSuccess: refresh,
    networkMode: 'always',
  });
  return {
    members: team.data,
    pending: invites.data?.filter((i) => i.acceptedAt === null),
    waitingForSignal: team.fetchStatus === 'paused' && team.data === undefined,
    loadError: team.data === undefined ? team.error : null,
    invite,
    remove,
    withdraw,
  };
}
