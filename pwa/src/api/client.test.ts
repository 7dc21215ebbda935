// @vitest-environment node
import { describe, expect, it, vi } from 'vitest';
import { createSessionStore } from '../features/auth/model/sessionStore';
import { MemoryStorage } from '../test/memoryStorage';
import { aSession, json } from '../test/sessions';
import { createApiClient, type RefreshLock } from './client';
import { ApiError, NetworkError } from './errors';

const noLock: RefreshLock = (work) => work();

type Handler = (url: string, init: RequestInit) => Response | Promise<Response>;

function setup(handler: Handler, session = aSession()) {
  const storage = new MemoryStorage();
  const sessionStore = createSessionStore(storage);
  sessionStore.set(session);
  const calls: { url: string; auth: string | null; body: unknown }[] = [];
  const fetch = vi.fn((input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = input instanceof Request ? input.url : input.toString();
    const headers = new Headers(init.headers);
    calls.push({
      url,
      auth: headers.get('Authorization'),
      body: typeof init.body === 'string' ? JSON.parse(init.body) : undefined,
    });
    return Promise.resolve(handler(url, init));
  });
  const client = createApiClient({ sessionStore, fetch, lock: noLock });
  return { client, sessionStore, storage, calls, fetch };
}

const rotated = aSession({ accessToken: 'access-2', refreshToken: 'refresh-2' });

describe('API client', () => {
  it('sends the access token as a Bearer header', async () => {
    const { client, calls } = setup(() => json(200, { ok: true }));
    await expect(client.request('/api/things')).resolves.toEqual({ ok: true });
    expect(calls[0]?.auth).toBe('Bearer access-1');
  });

  it('refreshes once on a 401, stores the rotated tokens and retries with the new one', async () => {
    const { client, sessionStore, calls } = setup((url, init) => {
      if (url === '/api/auth/refresh') return json(200, rotated);
      const auth = new Headers(init.headers).get('Authorization');
      return auth === 'Bearer access-2' ? json(200, { jobs: [] }) : json(401, {});
    });

    await expect(client.request('/api/jobs')).resolves.toEqual({ jobs: [] });

    expect(calls.map((c) => c.url)).toEqual(['/api/jobs', '/api/auth/refresh', '/api/jobs']);
    expect(calls[1]?.body).toEqual({ refreshToken: 'refresh-1' });
    expect(sessionStore.get()?.refreshToken).toBe('refresh-2');
  });

  it('does not loop: a second 401 after refreshing is thrown, and the session stays', async () => {
    const { client, sessionStore, calls } = setup((url) =>
      url === '/api/auth/refresh'
        ? json(200, rotated)
        : json(401, { statusCode: 401, code: 'unauthorized', message: 'No' }),
    );

    await expect(client.request('/api/jobs')).rejects.toMatchObject({ status: 401 });
    expect(calls).toHaveLength(3);
    expect(sessionStore.get()?.refreshToken).toBe('refresh-2');
  });

  it('signs out only when the refresh itself is definitely refused (401)', async () => {
    const { client, sessionStore, storage } = setup((url) =>
      url === '/api/auth/refresh'
        ? json(401, { statusCode: 401, code: 'refresh-reused', message: 'Your session has ended' })
        : json(401, { statusCode: 401, code: 'unauthorized', message: 'Expired' }),
    );

    await expect(client.request('/api/jobs')).rejects.toBeInstanceOf(ApiError);
    expect(sessionStore.get()).toBeNull();
    expect(createSessionStore(storage).get()).toBeNull();
  });

  it('keeps the session when the refresh fails for want of a network', async () => {
    const { client, sessionStore, storage } = setup((url) => {
      if (url === '/api/auth/refresh') throw new TypeError('Failed to fetch');
      return json(401, {});
    });

    await expect(client.request('/api/jobs')).rejects.toBeInstanceOf(NetworkError);
    expect(sessionStore.get()).toEqual(aSession());
    expect(createSessionStore(storage).get()).toEqual(aSession());
  });

  it('keeps the session when the server errors during refresh (5xx is not a sign-out)', async () => {
    const { client, sessionStore } = setup((url) =>
      url === '/api/auth/refresh'
        ? json(503, { statusCode: 503, code: 'unavailable', message: 'Down' })
        : json(401, {}),
    );

    await expect(client.request('/api/jobs')).rejects.toMatchObject({ status: 503 });
    expect(sessionStore.get()).toEqual(aSession());
  });

  it('turns a failed fetch into a NetworkError and keeps the session', async () => {
    const { client, sessionStore } = setup(() => {
      throw new TypeError('Failed to fetch');
    });

    await expect(client.request('/api/auth/me')).rejects.toBeInstanceOf(NetworkError);
    expect(sessionStore.get()).not.toBeNull();
  });

  it('shares one refresh between requests that hit 401 together', async () => {
    let refreshes = 0;
    const { client } = setup((url, init) => {
      if (url === '/api/auth/refresh') {
        refreshes += 1;
        return json(200, rotated);
      }
      const auth = new Headers(init.headers).get('Authorization');
      return auth === 'Bearer access-2' ? json(200, { url }) : json(401, {});
    });

    await Promise.all([client.request('/api/a'), client.request('/api/b')]);
    expect(refreshes).toBe(1);
  });

  it('uses tokens another tab already rotated instead of reusing the old refresh token', async () => {
    const { client, storage, calls } = setup((url, init) => {
      if (url === '/api/auth/refresh') return json(401, {});
      const auth = new Headers(init.headers).get('Authorization');
      return auth === 'Bearer access-2' ? json(200, { ok: true }) : json(401, {});
    });
    // The other tab refreshed after our request left with access-1.
    createSessionStore(storage).set(rotated);

    await expect(client.request('/api/jobs')).resolves.toEqual({ ok: true });
    expect(calls.some((c) => c.url === '/api/auth/refresh')).toBe(false);
  });

  it('reads the server error shape into a typed error', async () => {
    const { client } = setup(() =>
      json(429, { statusCode: 429, code: 'too-many-requests', message: 'Slow down' }),
    );
    const error: unknown = await client
      .request('/api/auth/sign-in', { auth: false, body: {} })
      .catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 429, code: 'too-many-requests', message: 'Slow down' });
  });

  it('sends no token and never refreshes for calls made without auth', async () => {
    const { client, calls } = setup(() =>
      json(401, { statusCode: 401, code: 'invalid-credentials', message: 'Nope' }),
    );
    await expect(
      client.request('/api/auth/sign-in', { auth: false, body: { email: 'a', password: 'b' } }),
    ).rejects.toMatchObject({ code: 'invalid-credentials' });
    expect(calls).toHaveLength(1);
    expect(calls[0]?.auth).toBeNull();
  });

  it('answers undefined for 204 No Content', async () => {
    const { client } = setup(() => new Response(null, { status: 204 }));
    await expect(client.request('/api/auth/sign-out', { body: {} })).resolves.toBeUndefined();
  });
});
