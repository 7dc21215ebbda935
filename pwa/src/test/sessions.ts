import type { Session, SessionUser } from '../features/auth/model/session';

export function aUser(overrides: Partial<SessionUser> = {}): SessionUser {
  return {
    id: 'u-owner',
    email: 'owner@heronwake.example',
    name: 'Wren Okafor',
    role: 'owner',
    businessId: 'b-heronwake',
    businessName: 'Heronwake Mobile Finish',
    ...overrides,
  };
}

export function aSession(overrides: Partial<Session> = {}): Session {
  return {
    accessToken: 'access-1',
    refreshToken: 'refresh-1',
    user: aUser(),
    ...overrides,
  };
}

export function json(status: number, body: unknown): Response {
  return new Response(status === 204 ? null : JSON.stringify(body), {
    status,
    headers: { 'Content-Type': 'application/json' },
  });
}
