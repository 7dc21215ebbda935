// @vitest-environment node
import { describe, expect, it, vi } from 'vitest';
import { MemoryStorage } from '../../../test/memoryStorage';
import { aSession, aUser } from '../../../test/sessions';
import { createSessionStore, SESSION_STORAGE_KEY } from './sessionStore';

describe('session store', () => {
  it('survives a reload: a new store over the same storage opens signed in', () => {
    const storage = new MemoryStorage();
    createSessionStore(storage).set(aSession());

    const afterReload = createSessionStore(storage);

    expect(afterReload.get()).toEqual(aSession());
  });

  it('forgets the session on sign-out, also after a reload', () => {
    const storage = new MemoryStorage();
    const store = createSessionStore(storage);
    store.set(aSession());
    store.set(null);

    expect(store.get()).toBeNull();
    expect(createSessionStore(storage).get()).toBeNull();
  });

  it('treats a malformed stored value as signed out instead of crashing', () => {
    const storage = new MemoryStorage();
    storage.setItem(SESSION_STORAGE_KEY, '{"accessToken":"a","user":{"role":"admin"}}');
    expect(createSessionStore(storage).get()).toBeNull();

    storage.setItem(SESSION_STORAGE_KEY, 'not json');
    expect(createSessionStore(storage).get()).toBeNull();
  });

  it('returns the same object until the session changes (stable for React)', () => {
    const store = createSessionStore(new MemoryStorage());
    store.set(aSession());
    expect(store.get()).toBe(store.get());
  });

  it('tells subscribers about changes, and not about no-op writes', () => {
    const store = createSessionStore(new MemoryStorage());
    const listener = vi.fn();
    const unsubscribe = store.subscribe(listener);

    store.set(aSession());
    store.set(aSession());
    store.updateUser(aUser({ name: 'Wren O.' }));
    unsubscribe();
    store.set(null);

    expect(listener).toHaveBeenCalledTimes(2);
  });

  it('keeps the tokens when the user is refreshed from the server', () => {
    const store = createSessionStore(new MemoryStorage());
    store.set(aSession());
    store.updateUser(aUser({ role: 'tech' }));

    expect(store.get()?.accessToken).toBe('access-1');
    expect(store.get()?.user.role).toBe('tech');
  });

  it('picks up tokens another tab wrote when asked to reload', () => {
    const storage = new MemoryStorage();
    const store = createSessionStore(storage);
    store.set(aSession());
    createSessionStore(storage).set(aSession({ refreshToken: 'refresh-2' }));

    expect(store.reload()?.refreshToken).toBe('refresh-2');
  });

  it('keeps the session for this visit when storage refuses to write', () => {
    const storage = new MemoryStorage();
    vi.spyOn(storage, 'setItem').mockImplementation(() => {
      throw new DOMException('full', 'QuotaExceededError');
    });
    const store = createSessionStore(storage);
    store.set(aSession());
    expect(store.get()).toEqual(aSession());
  });
});
