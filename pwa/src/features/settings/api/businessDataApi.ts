import type { ApiClient } from '../../../api/client';

export type ExportFormat = 'json' | 'csv';

/** `GET /api/business/export` (owner): everything of the business, as JSON or a CSV zip. */
export function exportPath(format: ExportFormat): string {
  return `/api/business/export?format=${format}`;
}

/** What the server removed, per table. */
export interface DeletedBusiness {
  businessId: string;
  removed: Record<string, number>;
}

/**
 * `DELETE /api/business` (owner): deletes the business and everything of it, for good. The
 * server refuses (400) unless `confirmName` is the business's name.
 */
export function deleteBusiness(client: ApiClient, confirmName: string): Promise<DeletedBusiness> {
  return client.request<DeletedBusiness>('/api/business', {
    method: 'DELETE',
    body: { confirmName },
  });
}
