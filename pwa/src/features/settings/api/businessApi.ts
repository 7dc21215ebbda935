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

/** What the field settings sheet changes: each section sent replaces that section. */
export interface FieldSettingsPatch {
  units: { thickness: 'um' | 'mil'; temperature: 'C' | 'F' };
  drive: { roadFactor: number; averageSpeedKmh: number };
}

/** `PATCH /api/business` (owner): answers the business with its settings. */
export function saveFieldSettings(client: ApiClient, patch: FieldSettingsPatch): Promise<unknown> {
  return client.request<unknown>('/api/business', {
    method: 'PATCH',
    body: { settings: patch },
  });
}
