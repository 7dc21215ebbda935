import type { ApiClient } from '../../api/client';
import { NetworkError, toApiError } from '../../api/errors';
import type { SessionStore } from '../auth/model/sessionStore';
import type { BlobDownloader } from '../../db/blobCache';

interface DownloaderOptions {
  api: ApiClient;
  sessionStore: SessionStore;
  fetch?: typeof fetch;
  baseUrl?: string;
  /** A photo of a few MB on a weak signal takes a while; give up on silence after this. */
  timeoutMs?: number;
}

/**
 * GET /api/blobs/:sha256 with the session's token, refreshed once on a 401 through the API
 * client (shared with every other caller). No answer is a NetworkError; the server's no
 * (404: not an image this user may see) an ApiError, as for the JSON calls.
 */
export function createImageDownloader({
  api,
  sessionStore,
  fetch: fetchImpl = (input, init) => globalThis.fetch(input, init),
  baseUrl = '',
  timeoutMs = 60_000,
}: DownloaderOptions): BlobDownloader {
  async function send(sha256: string, token: string, signal?: AbortSignal): Promise<Response> {
    try {
      return await fetchImpl(`${baseUrl}/api/blobs/${sha256}`, {
        headers: { Authorization: `Bearer ${token}` },
        signal: signal ?? AbortSignal.timeout(timeoutMs),
        credentials: 'same-origin',
      });
    } catch (error) {
      throw new NetworkError(undefined, { cause: error });
    }
  }

  return async (sha256, signal) => {
    const session = sessionStore.get();
    if (!session) throw new NetworkError('Signed out: sign in to see this image');
    let response = await send(sha256, session.accessToken, signal);
    if (response.status === 401) {
      const refreshed = await api.refreshSession(session.refreshToken);
      if (!refreshed) throw await toApiError(response);
      response = await send(sha256, refreshed.accessToken, signal);
    }
    if (!response.ok) throw await toApiError(response);
    const mime = response.headers.get('Content-Type')?.split(';')[0]?.trim() ?? 'image/jpeg';
    try {
      return { data: await response.arrayBuffer(), mime };
    } catch (error) {
      throw new NetworkError(undefined, { cause: error });
    }
  };
}
