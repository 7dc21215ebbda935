import type { PullQuery, PullResponse, PushRequest, PushResponse } from '@panelpass/shared';
import type { ApiClient } from '../api/client';
import { NetworkError, toApiError } from '../api/errors';
import type { SessionStore } from '../features/auth/model/sessionStore';

/** The three calls the sync engine makes to the server. */
export interface SyncTransport {
  push(body: PushRequest): Promise<PushResponse>;
  pull(query: PullQuery): Promise<PullResponse>;
  /** Stores an image under its SHA-256 (idempotent: the same bytes again are fine). */
  putBlob(sha256: string, data: ArrayBuffer, mime: string): Promise<void>;
}

interface HttpTransportOptions {
  api: ApiClient;
  sessionStore: SessionStore;
  fetch?: typeof fetch;
  baseUrl?: string;
  /** An upload of a few MB on a weak signal takes a while; give up on silence after this. */
  uploadTimeoutMs?: number;
}

/** The sync calls over the app's API client (Bearer token, refresh once on a 401). */
export function createHttpTransport({
  api,
  sessionStore,
  fetch: fetchImpl = (input, init) => globalThis.fetch(input, init),
  baseUrl = '',
  uploadTimeoutMs = 120_000,
}: HttpTransportOptions): SyncTransport {
  async function sendBlob(sha256: string, data: ArrayBuffer, mime: string, token: string) {
    try {
      return await fetchImpl(`${baseUrl}/api/blobs/${sha256}`, {
        method: 'PUT',
        headers: {
          'Content-Type': mime,
          Authorization: `Bearer ${token}`,
          Accept: 'application/json',
        },
        body: data,
        signal: AbortSignal.timeout(uploadTimeoutMs),
        credentials: 'same-origin',
      });
    } catch (error) {
      throw new NetworkError(undefined, { cause: error });
    }
  }

  return {
    push: (body) => api.request<PushResponse>('/api/sync/push', { method: 'POST', body }),
    pull: ({ cursor, scope, clientId, limit }) =>
      api.request<PullResponse>(
        `/api/sync/pull?${new URLSearchParams({
          cursor: String(cursor),
          scope: String(scope),
          clientId,
          ...(limit === undefined ? {} : { limit: String(limit) }),
        }).toString()}`,
      ),
    async putBlob(sha256, data, mime) {
      const session = sessionStore.get();
      if (!session) throw new NetworkError('Signed out: the image waits on this phone');
      let response = await sendBlob(sha256, data, mime, session.accessToken);
      if (response.status === 401) {
        const refreshed = await api.refreshSession(session.refreshToken);
        if (!refreshed) throw await toApiError(response);
        response = await sendBlob(sha256, data, mime, refreshed.accessToken);
      }
      if (!response.ok) throw await toApiError(response);
    },
  };
}
