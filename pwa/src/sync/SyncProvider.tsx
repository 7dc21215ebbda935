import { useCallback, useEffect, useMemo, useState, type ReactNode } from 'react';
import type { CommandName } from '@panelpass/shared';
import { apiClient, sessionStore } from '../app/services';
import { useSession } from '../features/auth/hooks/useSession';
import { LocalDb, type DbOwner } from '../db/localDb';
import { mutate } from '../db/mutate';
import { SyncContext, type SyncContextValue } from './context';
import { SyncEngine } from './engine';
import { createHttpTransport } from './transport';
import { useLiveSyncStatus } from './useLiveSyncStatus';

interface Runtime {
  db: LocalDb;
  engine: SyncEngine;
}

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
  const [runtime, setRuntime] = useState<Runtime | null>(null);
  const forget = useCallback(() => setRuntime(null), []);

  useEffect(() => {
    if (!userId || !businessId || !role) return;
    const db = new LocalDb({ userId, businessId, role });
    const engine = new SyncEngine({
      db,
      transport: createHttpTransport({ api: apiClient, sessionStore }),
    });
    engine.start();
    setRuntime({ db, engine });
    void askForPersistentStorageOnce(db).catch(() => undefined);
    return () => {
      setRuntime(null);
      void engine.stop().finally(() => db.close());
    };
  }, [userId, businessId, role]);

  if (!runtime) return <SyncContext.Provider value={null}>{children}</SyncContext.Provider>;
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
  runtime: Runtime;
  onForget: () => void;
  children: ReactNode;
}) {
  const { db, engine } = runtime;
  const status = useLiveSyncStatus(db, engine);
  const actions = useMemo(
    (): Omit<SyncContextValue, 'status'> => ({
      db,
      mutate: (name, args) => mutate(db, name, args),
      syncNow: () => engine.syncNow(),
      async retryRejected(id) {
        const rejected = await db.rejected.get(id);
        if (!rejected) return;
        await mutate(db, rejected.name as CommandName, rejected.args as never);
        await db.rejected.delete(id);
      },
      async discardRejected(id) {
        await db.rejected.delete(id);
      },
      async forgetThisPhone() {
        // Let go of the live queries first: they would fail on a deleted database.
        onForget();
        await engine.stop();
        await db.delete();
      },
    }),
    [db, engine, onForget],
  );
  const value = useMemo(() => ({ ...actions, status }), [actions, status]);
  return <SyncContext.Provider value={value}>{children}</SyncContext.Provider>;
}
