import { useSync, type SyncStatusView } from './context';

const nothingToSend: SyncStatusView = {
  state: 'saved',
  pending: 0,
  waitingImages: 0,
  rejected: [],
  lastSyncAt: null,
  online: true,
  syncing: false,
  lastError: null,
};

/**
 * Pending count, last success, rejected changes, online and syncing — for the header badge,
 * the sync sheet and sign-out. "All saved" where nothing syncs (outside the signed-in shell).
 */
export function useSyncStatus(): SyncStatusView {
  return useSync()?.status ?? nothingToSend;
}
