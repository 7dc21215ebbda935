import { createContext, useContext } from 'react';
import type { CommandArgs, CommandName, RejectedMutation } from '@panelpass/shared';
import type { LocalDb, OutboxEntry } from '../db/localDb';

/**
 * What the header badge, the sync sheet and sign-out know about sync. Kept free of Dexie so
 * screens outside the signed-in shell (the customer's page) can ask without loading it.
 */
export interface SyncStatusView {
  /** What the badge says: rejected changes first, then changes still to send. */
  state: 'saved' | 'waiting' | 'needs-look';
  /** Mutations not yet confirmed by the server. */
  pending: number;
  /** Photos and signatures not yet uploaded. */
  waitingImages: number;
  rejected: RejectedMutation[];
  /** Server time of the last complete sync. */
  lastSyncAt: number | null;
  online: boolean;
  syncing: boolean;
  /** Why the last try failed, in words. */
  lastError: string | null;
  /** The last try found the server unreachable (no answer, or its 503) while online. */
  serverAway?: boolean;
}

export interface SyncContextValue {
  status: SyncStatusView;
  /** The phone's database, for screens that read it (live queries). */
  db: LocalDb;
  /** Records a change (see db/mutate.ts); errors come back as thrown, in words. */
  mutate<N extends CommandName>(name: N, args: CommandArgs[N]): Promise<OutboxEntry>;
  syncNow(): Promise<boolean>;
  /** Records a rejected change again as a new mutation, and forgets the rejection. */
  retryRejected(id: number): Promise<void>;
  discardRejected(id: number): Promise<void>;
  /** Stops syncing and deletes this person's data from the phone (before signing out). */
  forgetThisPhone(): Promise<void>;
}

export const SyncContext = createContext<SyncContextValue | null>(null);

/** The sync runtime of the signed-in shell; null elsewhere (sign-in, customer page). */
export function useSync(): SyncContextValue | null {
  return useContext(SyncContext);
}

/** The database and the actions: the same object for the whole session. */
export type SyncActions = Omit<SyncContextValue, 'status'>;

export const SyncActionsContext = createContext<SyncActions | null>(null);

/**
 * The database and the actions without the status. A screen that only reads the phone's rows
 * or records changes uses this, so it does not render again each time the status moves (a
 * single sync moves it several times: started, pulled, done) — only the badge and the few
 * screens that show the status do.
 */
export function useSyncActions(): SyncActions | null {
  return useContext(SyncActionsContext);
}

export function statusState(pending: number, rejected: number): SyncStatusView['state'] {
  if (rejected > 0) return 'needs-look';
  return pending > 0 ? 'waiting' : 'saved';
}
