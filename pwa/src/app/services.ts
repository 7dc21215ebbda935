import { createApiClient } from '../api/client';
import { createSessionStore, type SessionStore } from '../features/auth/model/sessionStore';

/** The app's one session store and one API client. */
export const sessionStore: SessionStore = createSessionStore(window.localStorage, {
  events: window,
});

export const apiClient = createApiClient({ sessionStore });
