// Live queries and the phone's database need a global indexedDB: give the test one first.
import 'fake-indexeddb/auto';
import { act, cleanup, render, screen, waitFor } from '@testing-library/react';
import { StrictMode, useEffect } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { sessionStore } from '../app/services';
import { LocalDb } from '../db/localDb';
import { aSession, aUser } from '../test/sessions';
import { useSync, useSyncActions } from './context';

/** The engine's code arrives only when the test lets it (a slow phone loading its chunk). */
const engineCode = vi.hoisted(() => {
  let release: () => void = () => undefined;
  const gate = new Promise<void>((resolve) => {
    release = resolve;
  });
  const syncNow = vi.fn(() => Promise.resolve(true));
  const start = vi.fn();
  return { gate, release: () => release(), syncNow, start };
});

vi.mock('./engine', async () => {
  await engineCode.gate;
  // One object, as the real engine keeps until its state changes.
  const running = {
    syncing: true,
    lastError: null,
    failures: 0,
    nextAttemptAt: null,
    serverAway: false,
  };
  class SyncEngine {
    getState = () => running;
    subscribe = () => () => undefined;
    start = engineCode.start;
    stop() {
      return Promise.resolve();
    }
    syncNow = engineCode.syncNow;
  }
  return { SyncEngine };
});

const { SyncProvider, openLocalDbEarly } = await import('./SyncProvider');

afterEach(() => {
  cleanup();
  sessionStore.set(null);
});

/** The provider's value as the probe last saw it. */
let lastValue: ReturnType<typeof useSync> = null;

function Probe() {
  const sync = useSync();
  lastValue = sync;
  return (
    <p>
      {sync ? 'database ready' : 'no database'} · {sync?.status.syncing ? 'syncing' : 'idle'}
    </p>
  );
}

describe('SyncProvider', () => {
  it("hands the phone's database to the screens before the sync engine's code has loaded", async () => {
    sessionStore.set(aSession());
    render(
      <SyncProvider>
        <Probe />
      </SyncProvider>,
    );
    // Today can read its data while the engine is still on its way.
    expect(await screen.findByText('database ready · idle')).toBeTruthy();

    // A sync asked for meanwhile waits for the engine, then runs.
    let synced: Promise<boolean> | undefined;
    act(() => {
      synced = lastValue?.syncNow();
    });
    expect(engineCode.syncNow).not.toHaveBeenCalled();
    engineCode.release();
    await waitFor(() => expect(screen.getByText('database ready · syncing')).toBeTruthy());
    expect(await synced).toBe(true);
    expect(engineCode.syncNow).toHaveBeenCalledTimes(1);
  });

  it('screens reading the database do not render again when the sync status moves', async () => {
    sessionStore.set(aSession());
    const seen: unknown[] = [];
    function Reader() {
      const actions = useSyncActions();
      if (actions) seen.push(actions);
      return <p>{actions ? 'reader has the database' : 'reader waits'}</p>;
    }
    render(
      <SyncProvider>
        <Reader />
        <Probe />
      </SyncProvider>,
    );
    // The engine's code comes (released by the test above) and its first sync starts: the
    // status moves from idle to syncing.
    await waitFor(() => expect(screen.getByText('database ready · syncing')).toBeTruthy());
    expect(screen.getByText('reader has the database')).toBeTruthy();
    // One render with the database, none for the status.
    expect(seen).toHaveLength(1);
    expect((seen[0] as { db: unknown }).db).toBe(lastValue?.db);
  });

  it('mounts the screens once: the database arriving does not mount them again', async () => {
    sessionStore.set(aSession());
    let mounts = 0;
    function Screen() {
      useEffect(() => {
        mounts += 1;
      }, []);
      return <Probe />;
    }
    render(
      <SyncProvider>
        <Screen />
      </SyncProvider>,
    );
    expect(await screen.findByText(/^database ready/)).toBeTruthy();
    await waitFor(() => expect(screen.getByText('database ready · syncing')).toBeTruthy());
    // The whole shell sits under the provider: mounting it again would build every page and
    // custom element twice at each start.
    expect(mounts).toBe(1);
  });

  describe('a database opened before the first render', () => {
    it('is the one the screens get', async () => {
      sessionStore.set(aSession({ user: aUser({ id: 'u-early' }) }));
      const early = openLocalDbEarly();
      expect(early).not.toBeNull();
      render(
        <SyncProvider>
          <Probe />
        </SyncProvider>,
      );
      expect(await screen.findByText(/^database ready/)).toBeTruthy();
      expect(lastValue?.db).toBe(early);
    });

    it("is in the screens' first render: they do not render again for it", async () => {
      sessionStore.set(aSession({ user: aUser({ id: 'u-first-render' }) }));
      const early = openLocalDbEarly();
      const renders: (string | null)[] = [];
      function Reader() {
        const actions = useSyncActions();
        renders.push(actions ? actions.db.owner.userId : null);
        return <p>{actions ? 'reader has the database' : 'reader waits'}</p>;
      }
      render(
        <SyncProvider>
          <Reader />
        </SyncProvider>,
      );
      expect(screen.getByText('reader has the database')).toBeTruthy();
      // The effect has run by now (render flushes it): it took the same database, no new render.
      await act(() => Promise.resolve());
      expect(renders).toEqual(['u-first-render']);
      expect(early?.owner.userId).toBe('u-first-render');
    });

    it('is closed and another opened when the effect runs twice (strict mode)', async () => {
      sessionStore.set(aSession({ user: aUser({ id: 'u-strict' }) }));
      const early = openLocalDbEarly();
      render(
        <StrictMode>
          <SyncProvider>
            <Probe />
          </SyncProvider>
        </StrictMode>,
      );
      expect(await screen.findByText(/^database ready/)).toBeTruthy();
      // The first effect's cleanup closed the early database; the screens hold the open one.
      await waitFor(() => expect(lastValue?.db).not.toBe(early));
      expect(lastValue?.db.owner.userId).toBe('u-strict');
      expect(early?.isOpen()).toBe(false);
      await lastValue?.db.open();
      expect(lastValue?.db.isOpen()).toBe(true);
    });

    it('is closed, and another opened, when someone else is signed in by then', async () => {
      sessionStore.set(aSession({ user: aUser({ id: 'u-before' }) }));
      const early = openLocalDbEarly();
      sessionStore.set(aSession({ user: aUser({ id: 'u-after' }) }));
      render(
        <SyncProvider>
          <Probe />
        </SyncProvider>,
      );
      expect(await screen.findByText(/^database ready/)).toBeTruthy();
      expect(lastValue?.db).not.toBe(early);
      expect(lastValue?.db.owner.userId).toBe('u-after');
      expect(early?.isOpen()).toBe(false);
    });

    it('is not opened for a customer or without a session', () => {
      sessionStore.set(null);
      expect(openLocalDbEarly()).toBeNull();
      sessionStore.set(aSession({ user: aUser({ id: 'u-customer', role: 'customer' }) }));
      expect(openLocalDbEarly()).toBeNull();
    });
  });

  describe('when the first sync starts', () => {
    // The browser's idle moment comes only when the test says so.
    let idleWork: (() => void) | null = null;
    afterEach(() => {
      cleanup();
      idleWork = null;
      Reflect.deleteProperty(window, 'requestIdleCallback');
      Reflect.deleteProperty(window, 'cancelIdleCallback');
    });
    const stubIdle = () => {
      Object.assign(window, {
        requestIdleCallback: (work: () => void) => {
          idleWork = work;
          return 1;
        },
        cancelIdleCallback: () => undefined,
      });
    };

    it('a phone that has never synced starts at once, without waiting for the browser to be idle', async () => {
      stubIdle();
      engineCode.start.mockClear();
      sessionStore.set(aSession({ user: aUser({ id: 'u-new-phone' }) }));
      render(
        <SyncProvider>
          <Probe />
        </SyncProvider>,
      );
      await waitFor(() => expect(engineCode.start).toHaveBeenCalledTimes(1));
      expect(idleWork).not.toBeNull();
    });

    it('a phone holding synced work lets the first screen settle first', async () => {
      const user = aUser({ id: 'u-synced-phone' });
      const held = new LocalDb({ userId: user.id, businessId: user.businessId, role: user.role });
      await held.setMeta('lastSyncAt', 1_700_000_000_000);
      held.close();
      stubIdle();
      engineCode.start.mockClear();
      sessionStore.set(aSession({ user }));
      render(
        <SyncProvider>
          <Probe />
        </SyncProvider>,
      );
      expect(await screen.findByText('database ready · idle')).toBeTruthy();
      // The database has answered (the screen reads it) and still no engine.
      await new Promise((resolve) => setTimeout(resolve, 50));
      expect(engineCode.start).not.toHaveBeenCalled();
      act(() => idleWork?.());
      await waitFor(() => expect(engineCode.start).toHaveBeenCalledTimes(1));
    });
  });
});
