import { queryOptions } from '@tanstack/react-query';
import type { ApiClient } from '../../../api/client';
import { ApiError, NetworkError, toApiError } from '../../../api/errors';
import type { SessionStore } from '../../auth/model/sessionStore';
import { parseSession, type Session } from '../../auth/model/session';
import type { ConditionRecord } from '../model/conditionRecordWords';
import type { CustomerJob } from '../model/customerWords';
import type { CustomerQuote, QuoteRecord } from '../model/quoteRecord';

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

/**
 * A call outside the JSON client (a PDF, an image, raw bytes up) with the session's token,
 * refreshed once on a 401. No answer at all is a NetworkError, as for the JSON client.
 */
export async function authorizedFetch(
  client: ApiClient,
  store: SessionStore,
  url: string,
  init: { method?: 'GET' | 'PUT'; body?: Uint8Array; contentType?: string } = {},
): Promise<Response> {
  const send = async (token: string | undefined) => {
    try {
      return await fetch(url, {
        method: init.method ?? 'GET',
        headers: {
          ...(token ? { Authorization: `Bearer ${token}` } : {}),
          ...(init.contentType ? { 'Content-Type': init.contentType } : {}),
        },
        body: init.body
          ? new Blob([new Uint8Array(init.body)], { type: init.contentType })
          : undefined,
        credentials: 'same-origin',
      });
    } catch (error) {
      throw new NetworkError(undefined, { cause: error });
    }
  };
  const session = store.get();
  let response = await send(session?.accessToken);
  if (response.status === 401 && session) {
    const fresh = await client.refreshSession(session.refreshToken);
    if (fresh) response = await send(fresh.accessToken);
  }
  if (!response.ok) throw await toApiError(response);
  return response;
}

/** A PDF or an image fetched with the session, as a blob. */
export async function fetchDocument(
  client: ApiClient,
  store: SessionStore,
  url: string,
): Promise<Blob> {
  return (await authorizedFetch(client, store, url)).blob();
}

export interface PaymentLink {
  checkoutUrl: string | null;
}

/** A card payment link: the balance, or the deposit of a job booked from a quote. */
export function requestPayment(
  client: ApiClient,
  jobId: string,
  ids: { id: string; opId: string },
  kind: 'balance' | 'deposit' = 'balance',
): Promise<PaymentLink> {
  return client.request<PaymentLink>(`/api/jobs/${jobId}/payment-requests`, {
    method: 'POST',
    body: { ...ids, kind },
  });
}

/** Whose customer this is: the business's name, currency and time zone. */
export interface CustomerArea {
  customer: { id: string; name: string };
  business: { name: string; currency: string; timezone: string };
}

export const customerAreaQuery = (client: ApiClient, userId: string) =>
  queryOptions({
    queryKey: ['customer-area', userId],
    queryFn: ({ signal }) => client.request<CustomerArea>('/api/customer-area', { signal }),
  });

/** The quotes sent to this customer (never a draft), newest first. */
export const customerQuotesQuery = (client: ApiClient, userId: string) =>
  queryOptions({
    queryKey: ['customer-quotes', userId],
    queryFn: ({ signal }) =>
      client.request<{ items: CustomerQuote[] }>('/api/quotes?limit=100', { signal }),
  });

/** One quote with its lines. */
export const customerQuoteQuery = (client: ApiClient, quoteId: string) =>
  queryOptions({
    queryKey: ['customer-quote', quoteId],
    queryFn: ({ signal }) =>
      client.request<CustomerQuote>(`/api/quotes/${encodeURIComponent(quoteId)}`, { signal }),
  });

export interface CustomerVehicle {
  id: string;
  bodyStyle: string;
  make: string | null;
  model: string | null;
  colour: string | null;
  year: number | null;
}

export const customerVehiclesQuery = (client: ApiClient, userId: string) =>
  queryOptions({
    queryKey: ['customer-vehicles', userId],
    queryFn: ({ signal }) => client.request<CustomerVehicle[]>('/api/vehicles', { signal }),
  });

export const conditionRecordQuery = (client: ApiClient, jobId: string) =>
  queryOptions({
    queryKey: ['condition-record', jobId],
    queryFn: ({ signal }) =>
      client.request<ConditionRecord>(`/api/jobs/${encodeURIComponent(jobId)}/condition-record`, {
        signal,
      }),
  });

/** An image the customer may see (their photos, signatures), as a blob. */
export const customerImageQuery = (client: ApiClient, store: SessionStore, url: string) =>
  queryOptions({
    queryKey: ['customer-image', url],
    queryFn: () => fetchDocument(client, store, url),
    // An image under its hash never changes.
    staleTime: Infinity,
  });

/** The ids of one acceptance: made once, so a retry after a lost answer repeats the same. */
export interface AcceptIds {
  signatureId: string;
  jobId: string;
}

/**
 * Signs and accepts a quote: the signature's PNG up, `signature.capture` of kind quote over the
 * record shown with its hash, then `quote.accept`, which books the visit. Each step is safe to
 * repeat with the same ids.
 */
export async function signAndAccept(
  client: ApiClient,
  store: SessionStore,
  args: {
    ids: AcceptIds;
    record: QuoteRecord;
    recordHash: string;
    signerName: string;
    png: Uint8Array;
  },
): Promise<CustomerJob> {
  const { ids, record } = args;
  const quoteId = record.quoteId;
  const stored = await authorizedFetch(
    client,
    store,
    `/api/quotes/${encodeURIComponent(quoteId)}/signature-image`,
    { method: 'PUT', body: args.png, contentType: 'image/png' },
  );
  const image = (await stored.json()) as { sha256: string };
  await client.request('/api/signatures', {
    method: 'POST',
    body: {
      id: ids.signatureId,
      quoteId,
      kind: 'quote',
      signerName: args.signerName,
      imageSha256: image.sha256,
      record,
      recordHash: args.recordHash,
    },
  });
  return client.request<CustomerJob>(`/api/quotes/${encodeURIComponent(quoteId)}/accept`, {
    method: 'POST',
    body: {
      jobId: ids.jobId,
      windowStart: record.visit.windowStart,
      windowEnd: record.visit.windowEnd,
    },
  });
}

export function declineQuote(client: ApiClient, quoteId: string): Promise<CustomerQuote> {
  return client.request<CustomerQuote>(`/api/quotes/${encodeURIComponent(quoteId)}/decline`, {
    method: 'POST',
    body: {},
  });
}
