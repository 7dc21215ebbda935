import { isNetworkError } from '../../../api/errors';

/** What the screen needs to say about the network, from the device and from the answers. */
export interface LedgerConnection {
  /** No network, or the server could not be reached: the Ledger needs a connection. */
  needsConnection: boolean;
  /** The device itself says it has no network (trying again now cannot help). */
  deviceOffline: boolean;
  /** Figures are on screen although they could not be checked now: when they were loaded. */
  shownFromMs: number | null;
  /** Something the screen wants has never been loaded here (nothing to show for it). */
  somethingMissing: boolean;
}

export interface Loadable {
  data: unknown;
  error: unknown;
  fetchStatus: string;
  dataUpdatedAt: number;
}

/** The rule, apart from React: offline or unreachable, and what is shown from before. */
export function connectionOf(online: boolean, queries: readonly Loadable[]): LedgerConnection {
  const unreachable = queries.some(
    (q) => isNetworkError(q.error) || (q.fetchStatus === 'paused' && q.data === undefined),
  );
  const needsConnection = !online || unreachable;
  const loaded = queries.filter((q) => q.data !== undefined).map((q) => q.dataUpdatedAt);
  return {
    needsConnection,
    deviceOffline: !online,
    shownFromMs: needsConnection && loaded.length ? Math.min(...loaded) : null,
    somethingMissing: needsConnection && queries.some((q) => q.data === undefined),
  };
}
