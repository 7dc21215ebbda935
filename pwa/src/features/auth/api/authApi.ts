import { queryOptions } from '@tanstack/react-query';
import type { ApiClient } from '../../../api/client';
import { ApiError } from '../../../api/errors';
import { parseSession, parseSessionUser, type Session, type SessionUser } from '../model/session';

export interface SignInInput {
  email: string;
  password: string;
}

export interface SignUpInput {
  businessName: string;
  name: string;
  email: string;
  password: string;
}

export interface AcceptInviteInput {
  token: string;
  name: string;
  password: string;
}

function readSession(body: unknown): Session {
  const session = parseSession(body);
  if (!session) throw new ApiError(502, 'bad-session', 'The server sent a session we cannot read');
  return session;
}

export async function signIn(client: ApiClient, input: SignInInput): Promise<Session> {
  return readSession(await client.request('/api/auth/sign-in', { auth: false, body: input }));
}

export async function signUp(client: ApiClient, input: SignUpInput): Promise<Session> {
  return readSession(await client.request('/api/auth/sign-up', { auth: false, body: input }));
}

export async function acceptInvite(
  client: ApiClient,
  { token, ...body }: AcceptInviteInput,
): Promise<Session> {
  const path = `/api/invites/${encodeURIComponent(token)}/accept`;
  return readSession(await client.request(path, { auth: false, body }));
}

/** Ends the refresh token's family on the server. No refresh first: we are leaving anyway. */
export async function signOut(client: ApiClient, refreshToken: string): Promise<void> {
  await client.request<undefined>('/api/auth/sign-out', {
    method: 'POST',
    body: { refreshToken },
    refreshOnUnauthorized: false,
  });
}

export async function fetchCurrentUser(client: ApiClient): Promise<SessionUser> {
  const user = parseSessionUser(await client.request('/api/auth/me'));
  if (!user) throw new ApiError(502, 'bad-user', 'The server sent a user we cannot read');
  return user;
}

export const currentUserQuery = (client: ApiClient, userId: string) =>
  queryOptions({
    queryKey: ['auth', 'me', userId],
    queryFn: () => fetchCurrentUser(client),
  });
