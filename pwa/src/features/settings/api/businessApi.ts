import { queryOptions } from '@tanstack/react-query';
import type { ApiClient } from '../../../api/client';

/**
 * `GET /api/business`: the owner gets the profile with its settings, a helper only the
 * business's name. Kept as it came; `readFieldSettings` picks out what the field screens use.
 */
export const businessQuery = (client: ApiClient, businessId: string) =>
  queryOptions({
    queryKey: ['business', businessId],
    queryFn: ({ signal }) => client.request<unknown>('/api/business', { signal }),
    staleTime: 5 * 60_000,
  });
