/**
 * What the sync badge says. A placeholder until the outbox exists: nothing is written
 * locally yet, so everything there is is saved.
 */
export type SyncStatus =
  { state: 'saved' } | { state: 'waiting'; count: number } | { state: 'needs-look'; count: number };

export function useSyncStatus(): SyncStatus {
  return { state: 'saved' };
}
