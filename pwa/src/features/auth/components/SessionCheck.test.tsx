import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { sessionStore } from '../../../app/services';
import { aSession, aUser } from '../../../test/sessions';
import type { SessionUser } from '../model/session';

/** What the server answers for the signed-in user, and how often it was asked. */
const server = vi.hoisted(() => ({ user: null as SessionUser | null, asked: 0 }));
vi.mock('../api/authApi', () => ({
  currentUserQuery: (_client: unknown, userId: string) => ({
    queryKey: ['auth', 'me', userId],
    queryFn: () => {
      server.asked += 1;
      return Promise.resolve(server.user);
    },
  }),
}));
// The first screen is up: the check may run.
vi.mock('../../../app/useAfterStart', () => ({ useAfterStart: () => true }));

const { SessionCheck } = await import('./SessionCheck');
const { useCurrentUser } = await import('../hooks/useCurrentUser');

afterEach(() => {
  cleanup();
  sessionStore.set(null);
  server.asked = 0;
});

/** Stands for the tab shell: counts its renders, shows the business it reads. */
function showShell() {
  const renders: string[] = [];
  function Shell() {
    const user = useCurrentUser();
    renders.push(user?.businessName ?? '-');
    return <p>{user?.businessName}</p>;
  }
  render(
    <QueryClientProvider client={new QueryClient()}>
      <SessionCheck />
      <Shell />
    </QueryClientProvider>,
  );
  return renders;
}

describe('SessionCheck', () => {
  it('the server confirming the kept user renders nothing again', async () => {
    sessionStore.set(aSession());
    server.user = aUser();
    const renders = showShell();
    await waitFor(() => expect(server.asked).toBe(1));
    // Let the answer arrive and settle.
    await new Promise((resolve) => setTimeout(resolve, 20));
    expect(renders).toEqual(['Heronwake Mobile Finish']);
  });

  it('a change on the server reaches the kept session and what shows it', async () => {
    sessionStore.set(aSession());
    server.user = aUser({ businessName: 'Heronwake Finish & Film' });
    const renders = showShell();
    expect(await screen.findByText('Heronwake Finish & Film')).toBeTruthy();
    expect(sessionStore.get()?.user.businessName).toBe('Heronwake Finish & Film');
    expect(renders).toEqual(['Heronwake Mobile Finish', 'Heronwake Finish & Film']);
  });

  it('keeps nothing from an answer about someone else (signed out and in meanwhile)', async () => {
    sessionStore.set(aSession());
    server.user = aUser({ id: 'u-other', businessName: 'Someone Else' });
    showShell();
    await waitFor(() => expect(server.asked).toBe(1));
    await new Promise((resolve) => setTimeout(resolve, 20));
    expect(sessionStore.get()?.user.businessName).toBe('Heronwake Mobile Finish');
  });
});
