import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useMemo } from 'react';
import { apiClient } from '../../../app/services';
import { useSession } from '../../auth/hooks/useSession';
import {
  businessQuery,
  readBusiness,
  saveBusiness,
  type BusinessPatch,
  type OwnerBusiness,
} from '../api/businessApi';

/**
 * The owner's business and its settings from the server (settings live there only, so this
 * needs a signal), and the save. A save's answer becomes the business everyone reads, the
 * field screens' units included.
 */
export function useBusinessSettings() {
  const user = useSession()?.user ?? null;
  const businessId = user?.businessId ?? '';
  const isOwner = user?.role === 'owner';
  const client = useQueryClient();
  const query = useQuery({
    ...businessQuery(apiClient, businessId),
    enabled: businessId !== '' && isOwner,
    // Settings are being edited: ask afresh on opening, not the field screens' cached copy.
    staleTime: 0,
  });
  const business: OwnerBusiness | null = useMemo(() => readBusiness(query.data), [query.data]);
  const save = useMutation({
    mutationFn: (patch: BusinessPatch) => saveBusiness(apiClient, patch),
    // Try at once and say so when there is no signal, rather than wait paused for one.
    networkMode: 'always',
    onSuccess: (answer) => client.setQueryData(['business', businessId], answer),
  });
  return {
    businessId,
    business,
    /** No answer yet and none can come: no signal. */
    waitingForSignal: query.fetchStatus === 'paused' && query.data === undefined,
    loadError: query.data === undefined ? query.error : null,
    retry: () => void query.refetch(),
    save,
  };
}
