import { queryOptions } from '@tanstack/react-query';
import type { ApiClient } from '../../../api/client';
import { ApiError, toApiError } from '../../../api/errors';
import type { SessionStore } from '../../auth/model/sessionStore';
import { parseSession, type Session } from '../../auth/model/session';
import type { CustomerJob } from '../model/customerWords';

/** Spends an e-mailed sign-in link (public): a customer session, or 410 with the reason. */
export async function redeemLink(client: ApiClient, token: string): Promise<Session> {
  const answer = await client.request<unknown>(
    `/api/customer-links/${encodeURIComponent(token)}/redeem`,
    { method: 'POST', auth: false },
  );
  const session = parseSession(answer);
  if (!session) throw new ApiError(502, 'bad-session', 'The server sent a session we cannot read');
  return session;
}

export const customerJobsQuery = (client: ApiClient, userId: string) =>
  queryOptions({
    queryKey: ['customer-jobs', userId],
    queryFn: ({ signal }) =>
      client.request<{ items: CustomerJob[] }>('/api/jobs?limit=100', { signal }),
  });

export interface JobDocument {
  title: string;
  url: string;
}

export interface JobDocuments {
  report: JobDocument;
  invoice: (JobDocument & { id: string; number: number }) | null;
}

export const jobDocumentsQuery = (client: ApiClient, jobId: string) =>
  queryOptions({
    queryKey: ['job-documents', jobId],
    queryFn: ({ signal }) =>
      client.request<JobDocuments>(`/api/jobs/${jobId}/documents`, { signal }),
  });

/** A PDF fetched with the session (refreshed once on a 401), as a blob. */
export async function fetchDocument(
  client: ApiClient,
  store: SessionStore,
  url: string,
): Promise<Blob> {
  const get = (token: string | undefined) =>
    fetch(url, {
      headers: token ? { Authorization: `Bearer ${token}` } : {},
      credentials: 'same-origin',
    });
  const session = store.get();
  let response = await get(session?.accessToken);
  if (response.status === 401 && session) {
    const fresh = await client.refreshSession(session.refreshToken);
    if (fresh) response = await get(fresh.accessToken);
  }
  if (!response.ok) throw await toApiError(response);
  return response.blob();
}

export interface PaymentLink {
  checkoutUrl: string | null;
}

export function requestPayment(
  client: ApiClient,
  jobId: string,
  ids: { id: string; opId: string },
): Promise<PaymentLink> {
  return client.request<PaymentLink>(`/api/jobs/${jobId}/payment-requests`, {
    method: 'POST',
    body: { ...ids, kind: 'balance' },
  });
}
