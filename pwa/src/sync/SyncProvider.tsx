import { useCallback, useEffect, useMemo, useState, type ReactNode } from 'react';
import type { CommandName } from '@panelpass/shared';
import { whenIdle } from '../app/lazySheet';
import { apiClient, sessionStore } from '../app/services';
import { useSession } from '../features/auth/hooks/useSession';
import { LocalDb, type DbOwner } from '../db/localDb';
import { SyncActionsContext, SyncContext, type SyncActions } from './context';
import type { SyncEngine } from './engine';
import { useLiveSyncStatus } from './useLiveSyncStatus';

/**
 * The engine (push, pull, rebase) and the commands' local effects are loaded beside the first
 * screen, not before it: Today reads the phone's database and needs neither to show, so the
 * database is handed to the screens at once and only sending and fetching wait for the engine,
 * which is loaded once the browser is first idle (so not while Today renders; a phone that has
 * never synced, with nothing to render, loads it at once). Both are
 * precached by the service worker, so this works offline too.
 */
const loadEngine = () =>
  Promise.all([import('./engine'), import('./transport')]).then(([engine, transport]) => ({
    SyncEngine: engine.SyncEngine,
    createHttpTransport: transport.createHttpTransport,
  }));
const loadMutate = () => import('../db/mutate').then((m) => m.mutate);

interface Runtime {
  db: LocalDb;
  /** Null for the moment its code takes to load, after the first screen has its data. */
  engine: SyncEngine | null;
  /** The started engine; null when the session ended first (or its code could not load). */
  started: Promise<SyncEngine | null>;
}

/** What the status reads from an engine that has not started yet: nothing running, no error. */
const notStarted: Pick<SyncEngine, 'subscribe' | 'getState'> = {
  subscribe: () => () => undefined,
  getState: () => NOT_STARTED_STATE,
};
const NOT_STARTED_STATE = {
  syncing: false,
  lastError: null,
  failures: 0,
  nextAttemptAt: null,
  serverAway: false,
};

/**
 * Asks the browser once, after sign-in, to keep this app's storage under pressure (Safari
 * and others may otherwise evict it after days without use). The answer is the browser's;
 * syncing often is what really keeps the work safe.
 */
async function askForPersistentStorageOnce(db: LocalDb): Promise<void> {
  if (await db.getMeta('persistAsked')) return;
  await db.setMeta('persistAsked', true);
  try {
    if (navigator.storage?.persist && !(await navigator.storage.persisted())) {
      await navigator.storage.persist();
    }
  } catch {
    // Not offered here (older browsers, private windows): nothing to do.
  }
}

/** The database opened before the first render (`openLocalDbEarly`), until the provider takes it. */
let early: LocalDb | null = null;

/**
 * Starts opening the signed-in person's database before the first render (boot.tsx, through
 * App's preloadFirstScreen), so it opens while the shell renders: the provider's effect only
 * runs after the shell's first commit, and opening it there put it behind all of that work.
 */
export function openLocalDbEarly(): LocalDb | null {
  const user = sessionStore.get()?.user;
  if (early || !user || user.role === 'customer') return early;
  early = new LocalDb({ userId: user.id, businessId: user.businessId, role: user.role });
  early.open().catch(() => undefined);
  return early;
}

function ownedBy(db: LocalDb, owner: DbOwner): boolean {
  return (
    db.owner.userId === owner.userId &&
    db.owner.businessId === owner.businessId &&
    db.owner.role === owner.role
  );
}

/** The database opened early when it is this person's, else a new one. */
function takeLocalDb(owner: DbOwner): LocalDb {
  const db = early;
  early = null;
  if (db && ownedBy(db, owner)) return db;
  db?.close();
  return new LocalDb(owner);
}

/**
 * The runtime of the provider's first render, when this person's database was opened early: the
 * screens read it in that render, instead of in a second one once the effect has run (that
 * second render ran inside the first screen's longest task at every start). Only looks: the
 * effect takes the database (`takeLocalDb`) and settles `started`.
 */
function firstRuntime(owner: DbOwner | null): FirstRuntime | null {
  const db = early;
  if (!owner || !db || !ownedBy(db, owner)) return null;
  let settle: (started: Promise<SyncEngine | null>) => void = () => undefined;
  const started = new Promise<SyncEngine | null>((resolve) => {
    settle = resolve;
  });
  return { runtime: { db, engine: null, started }, settle };
}

interface FirstRuntime {
  runtime: Runtime;
  /** Hands the effect's `started` to the first runtime's (once). */
  settle: (started: Promise<SyncEngine | null>) => void;
}

/**
 * The signed-in shell's sync: opens this person's database on the phone, starts the engine,
 * and stops it at sign-out (or when the session ends). Screens below read the status and
 * record changes through `useSync()`.
 */
export function SyncProvider({ children }: { children: ReactNode }) {
  const user = useSession()?.user ?? null;
  const owner: DbOwner | null =
    user && user.role !== 'customer'
      ? { userId: user.id, businessId: user.businessId, role: user.role }
      : null;
  const userId = owner?.userId;
  const businessId = owner?.businessId;
  const role = owner?.role;
  const [first] = useState(() => ({ current: firstRuntime(owner) }));
  const [runtime, setRuntime] = useState<Runtime | null>(() => first.current?.runtime ?? null);
  const forget = useCallback(() => setRuntime(null), []);

  useEffect(() => {
    if (!userId || !businessId || !role) return;
    const db = takeLocalDb({ userId, businessId, role });
    // The first render's runtime, when it holds this database (used once: after a cleanup, as
    // in React's strict mode or at a new sign-in, the database is closed and another opened).
    const initial = first.current?.runtime.db === db ? first.current : null;
    first.current = null;
    let ended = false;
    let engine: SyncEngine | null = null;
    let cancelIdle = () => undefined as void;
    const idle = new Promise<void>((resolve) => {
      cancelIdle = whenIdle(resolve);
      // A phone that has never synced has nothing to show until its first sync is in: that
      // one starts as soon as the database answers, not once the first screen has settled
      // (the first pull leaves about 70 ms sooner after signing in on a new phone).
      db.getMeta('lastSyncAt').then(
        (at) => at ?? resolve(),
        () => 0,
      );
    });
    const started: Promise<SyncEngine | null> = idle.then(loadEngine).then(
      ({ SyncEngine, createHttpTransport }) => {
        if (ended) return null;
        engine = new SyncEngine({
          db,
          transport: createHttpTransport({ api: apiClient, sessionStore }),
        });
        engine.start();
        setRuntime({ db, engine, started: initial?.runtime.started ?? started });
        void askForPersistentStorageOnce(db).catch(() => undefined);
        return engine;
      },
      () => null,
    );
    if (initial) initial.settle(started);
    else setRuntime({ db, engine: null, started });
    return () => {
      ended = true;
      cancelIdle();
      setRuntime(null);
      if (engine) void engine.stop().finally(() => db.close());
      else db.close();
    };
  }, [first, userId, businessId, role]);

  // One tree whether or not the database is there yet: a different element here when it
  // arrives would mount the whole shell below (every page and custom element) a second time.
  return (
    <LiveSync runtime={runtime} onForget={forget}>
      {children}
    </LiveSync>
  );
}

function LiveSync({
  runtime,
  onForget,
  children,
}: {
  runtime: Runtime | null;
  onForget: () => void;
  children: ReactNode;
}) {
  const db = runtime?.db ?? null;
  const started = runtime?.started ?? null;
  // The stand-in is only read (subscribe, getState) by the status hook.
  const status = useLiveSyncStatus(db, runtime?.engine ?? (notStarted as SyncEngine));
  const actions = useMemo(
    (): SyncActions | null =>
      db && started
        ? {
            db,
            mutate: async (name, args) => (await loadMutate())(db, name, args),
            syncNow: async () => (await started)?.syncNow() ?? false,
            async retryRejected(id) {
              const rejected = await db.rejected.get(id);
              if (!rejected) return;
              await (
                await loadMutate()
              )(db, rejected.name as CommandName, rejected.args as never);
              await db.rejected.delete(id);
            },
            async discardRejected(id) {
              await db.rejected.delete(id);
            },
            async forgetThisPhone() {
              // Let go of the live queries first: they would fail on a deleted database.
              onForget();
              await (await started)?.stop();
              await db.delete();
            },
          }
        : null,
    [db, started, onForget],
  );
  const value = useMemo(() => (actions ? { ...actions, status } : null), [actions, status]);
  // Two contexts: the status moves at every sync, the database and the actions do not.
  return (
    <SyncActionsContext.Provider value={actions}>
      <SyncContext.Provider value={value}>{children}</SyncContext.Provider>
    </SyncActionsContext.Provider>
  );
}
