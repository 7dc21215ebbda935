import { parseSession, type Session, type SessionUser } from './session';

export const SESSION_STORAGE_KEY = 'panelpass.session.v1';

/**
 * The signed-in session, kept in local storage so the app opens signed in after a reload or
 * a day without signal. One store per app; React reads it through useSyncExternalStore.
 */
export interface SessionStore {
  // Properties rather than methods: React takes `get` and `subscribe` on their own.
  /** The current session; the same object until it changes. */
  get: () => Session | null;
  set: (next: Session | null) => void;
  /** Keeps the tokens and replaces who is signed in (a fresh copy from the server). */
  updateUser: (user: SessionUser) => void;
  /** Reads storage again: another tab may have rotated the tokens a moment ago. */
  reload: () => Session | null;
  subscribe: (listener: () => void) => () => void;
}

interface SessionStoreOptions {
  key?: string;
  /** Where `storage` events from other tabs arrive; none in tests. */
  events?: Pick<Window, 'addEventListener'>;
}

export function createSessionStore(
  storage: Storage,
  { key = SESSION_STORAGE_KEY, events }: SessionStoreOptions = {},
): SessionStore {
  const listeners = new Set<() => void>();

  function read(): Session | null {
    try {
      const raw = storage.getItem(key);
      return raw ? parseSession(JSON.parse(raw)) : null;
    } catch {
      return null;
    }
  }

  let current = read();

  function sameSession(a: Session | null, b: Session | null): boolean {
    return JSON.stringify(a) === JSON.stringify(b);
  }

  function publish(next: Session | null) {
    if (sameSession(current, next)) return;
    current = next;
    for (const listener of listeners) listener();
  }

  function write(next: Session | null) {
    try {
      if (next) storage.setItem(key, JSON.stringify(next));
      else storage.removeItem(key);
    } catch {
      // Storage full or blocked: keep the session for this visit at least.
    }
    publish(next);
  }

  // Another tab signed in, out, or rotated the tokens.
  events?.addEventListener('storage', (event: StorageEvent) => {
    if (event.key === key || event.key === null) publish(read());
  });

  return {
    get: () => current,
    set: write,
    updateUser(user) {
      if (current) write({ ...current, user });
    },
    reload() {
      publish(read());
      return current;
    },
    subscribe(listener) {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}
