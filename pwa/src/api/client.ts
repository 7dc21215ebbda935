import { parseSession, type Session } from '../features/auth/model/session';
import type { SessionStore } from '../features/auth/model/sessionStore';
import { ApiError, NetworkError, toApiError } from './errors';

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** Sent as JSON. */
  body?: unknown;
  /** Add the access token (default true). Sign-in and friends send none. */
  auth?: boolean;
  /** On a 401, refresh the tokens once and try again (default true). */
  refreshOnUnauthorized?: boolean;
  signal?: AbortSignal;
}

export interface ApiClient {
  request<T>(path: string, options?: RequestOptions): Promise<T>;
  /**
   * Trades the refresh token for new tokens once, shared by every caller that hit a 401 at
   * the same time. Answers null only when the server definitely refused (a 401): the store is
   * then cleared, which signs the user out. No signal throws a NetworkError and keeps the
   * session, so the app still opens signed in offline.
   */
  refreshSession(staleRefreshToken: string): Promise<Session | null>;
}

/** Runs `work` while no other tab of this app is refreshing (Web Locks where available). */
export type RefreshLock = <T>(work: () => Promise<T>) => Promise<T>;

export const webRefreshLock: RefreshLock = async (work) => {
  if (typeof navigator === 'undefined' || !('locks' in navigator)) return work();
  // Web Locks hands back whatever `work` answers; awaiting it keeps the type plain.
  return await navigator.locks.request('panelpass-token-refresh', () => work());
};

interface ApiClientOptions {
  sessionStore: SessionStore;
  fetch?: typeof fetch;
  baseUrl?: string;
  lock?: RefreshLock;
  /** Give up on a silent server after this long, so a weak signal fails instead of hanging. */
  timeoutMs?: number;
}

export function createApiClient({
  sessionStore,
  fetch: fetchImpl = (input, init) => globalThis.fetch(input, init),
  baseUrl = '',
  lock = webRefreshLock,
  timeoutMs = 20_000,
}: ApiClientOptions): ApiClient {
  let refreshInFlight: Promise<Session | null> | null = null;

  async function send(
    path: string,
    options: RequestOptions,
    accessToken: string | null,
  ): Promise<Response> {
    const headers: Record<string, string> = { Accept: 'application/json' };
    if (options.body !== undefined) headers['Content-Type'] = 'application/json';
    if (accessToken) headers.Authorization = `Bearer ${accessToken}`;
    try {
      return await fetchImpl(`${baseUrl}${path}`, {
        method: options.method ?? (options.body === undefined ? 'GET' : 'POST'),
        headers,
        body: options.body === undefined ? undefined : JSON.stringify(options.body),
        signal: options.signal ?? AbortSignal.timeout(timeoutMs),
        credentials: 'same-origin',
      });
    } catch (error) {
      // The caller's own cancel is not a network fault; let it through unchanged.
      if (options.signal?.aborted) throw error;
      throw new NetworkError(undefined, { cause: error });
    }
  }

  async function refreshUnderLock(staleRefreshToken: string): Promise<Session | null> {
    const current = sessionStore.reload();
    if (!current) return null;
    // Someone already rotated the tokens (another request or tab): use theirs. Sending the
    // old refresh token again would look like reuse and end the whole session family.
    if (current.refreshToken !== staleRefreshToken) return current;

    const response = await send(
      '/api/auth/refresh',
      { method: 'POST', body: { refreshToken: current.refreshToken } },
      null,
    );
    if (response.status === 401) {
      sessionStore.set(null);
      return null;
    }
    if (!response.ok) throw await toApiError(response);
    const next = parseSession(await response.json());
    if (!next) throw new ApiError(502, 'bad-session', 'The server sent a session we cannot read');
    sessionStore.set(next);
    return next;
  }

  function refreshSession(staleRefreshToken: string): Promise<Session | null> {
    refreshInFlight ??= lock(() => refreshUnderLock(staleRefreshToken)).finally(() => {
      refreshInFlight = null;
    });
    return refreshInFlight;
  }

  async function request<T>(path: string, options: RequestOptions = {}): Promise<T> {
    const auth = options.auth ?? true;
    const session = auth ? sessionStore.get() : null;
    if (auth && !session) throw new ApiError(401, 'not-signed-in', 'Sign in to continue');

    let response = await send(path, options, session?.accessToken ?? null);

    if (response.status === 401 && session && (options.refreshOnUnauthorized ?? true)) {
      const refreshed = await refreshSession(session.refreshToken);
      if (!refreshed) throw await toApiError(response);
      // Exactly one retry: a second 401 with fresh tokens is an answer, not a stale token.
      response = await send(path, options, refreshed.accessToken);
    }

    if (!response.ok) throw await toApiError(response);
    if (response.status === 204) return undefined as T;
    return (await response.json()) as T;
  }

  return { request, refreshSession };
}
