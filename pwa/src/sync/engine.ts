import { blobsReferenced, PULL_PAGE_ROWS, type Mutation } from '@panelpass/shared';
import { isApiError, isNetworkError } from '../api/errors';
import { isQuotaError, OUT_OF_SPACE_MESSAGE } from '../db/errors';
import type { LocalDb, OutboxEntry } from '../db/localDb';
import { applyPull, applyPushResult, mergePage, type PulledChanges } from './apply';
import type { SyncTransport } from './transport';

/** Runs `work` unless another tab is already syncing this database (then answers SKIPPED). */
export type SyncLock = <T>(work: () => Promise<T>) => Promise<T | typeof SKIPPED>;
export const SKIPPED = Symbol('skipped: another tab is syncing');

/** Web Locks where the browser has them, so two tabs never push the same outbox at once. */
export function webSyncLock(name: string): SyncLock {
  return async (work) => {
    if (typeof navigator === 'undefined' || !('locks' in navigator)) return work();
    return await navigator.locks.request(name, { ifAvailable: true }, (lock) =>
      lock ? work() : SKIPPED,
    );
  };
}

export interface SyncEngineState {
  syncing: boolean;
  /** Why the last attempt failed, in words; null after a success. */
  lastError: string | null;
  /** Failed attempts in a row (the backoff grows with it). */
  failures: number;
  /** When the next attempt is due (this phone's clock), if one is scheduled. */
  nextAttemptAt: number | null;
  /**
   * The last attempt failed because the server did not answer, or answered that it cannot
   * work just now (502/503/504, e.g. its database is away) — while the phone had a signal.
   */
  serverAway: boolean;
}

export interface SyncEngineOptions {
  db: LocalDb;
  transport: SyncTransport;
  lock?: SyncLock;
  isOnline?: () => boolean;
  /** Where `online` comes from (window) and `visibilitychange` (document). */
  windowTarget?: Pick<EventTarget, 'addEventListener' | 'removeEventListener'>;
  documentTarget?: Pick<Document, 'addEventListener' | 'removeEventListener' | 'visibilityState'>;
  /** Between syncs when all went well: picks up the other phone's work. */
  intervalMs?: number;
  /** After a change on this phone, wait this long for the next one before sending. */
  debounceMs?: number;
  /** First retry after a failure; doubles each time up to `maxBackoffMs`. */
  minBackoffMs?: number;
  maxBackoffMs?: number;
  /** 0–1; spreads the retries of many phones after an outage (equal jitter). */
  random?: () => number;
  pushBatch?: number;
  maxPullPages?: number;
}

/**
 * The sync loop: upload images, push the outbox, pull and rebase. It runs when started, when
 * the phone comes online or the app becomes visible, soon after each change, and on a timer —
 * every `intervalMs` while all is well, with exponential backoff (capped) while it fails. One
 * run at a time in this tab, one tab at a time (Web Locks).
 */
export class SyncEngine {
  private readonly db: LocalDb;
  private readonly transport: SyncTransport;
  private readonly lock: SyncLock;
  private readonly isOnline: () => boolean;
  private readonly opts: Required<
    Pick<
      SyncEngineOptions,
      | 'intervalMs'
      | 'debounceMs'
      | 'minBackoffMs'
      | 'maxBackoffMs'
      | 'random'
      | 'pushBatch'
      | 'maxPullPages'
    >
  >;
  private state: SyncEngineState = {
    syncing: false,
    lastError: null,
    failures: 0,
    nextAttemptAt: null,
    serverAway: false,
  };
  private readonly listeners = new Set<() => void>();
  private running: Promise<boolean> | null = null;
  private again = false;
  private started = false;
  private stopped = false;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private debounce: ReturnType<typeof setTimeout> | null = null;
  private readonly cleanups: (() => void)[] = [];

  constructor(private readonly options: SyncEngineOptions) {
    this.db = options.db;
    this.transport = options.transport;
    this.lock = options.lock ?? webSyncLock(`panelpass-sync-${options.db.name}`);
    this.isOnline =
      options.isOnline ?? (() => (typeof navigator === 'undefined' ? true : navigator.onLine));
    this.opts = {
      intervalMs: options.intervalMs ?? 30_000,
      debounceMs: options.debounceMs ?? 800,
      minBackoffMs: options.minBackoffMs ?? 2_000,
      maxBackoffMs: options.maxBackoffMs ?? 60_000,
      random: options.random ?? Math.random,
      pushBatch: options.pushBatch ?? 100,
      maxPullPages: options.maxPullPages ?? 200,
    };
  }

  getState = (): SyncEngineState => this.state;

  subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  /** Begins: syncs now and listens for the moments to sync again. */
  start(): void {
    if (this.started || this.stopped) return;
    this.started = true;
    const win = this.options.windowTarget ?? (typeof window === 'undefined' ? undefined : window);
    const doc =
      this.options.documentTarget ?? (typeof document === 'undefined' ? undefined : document);
    const onOnline = () => {
      this.setState({ failures: 0 });
      void this.syncNow();
    };
    const onVisible = () => {
      if (doc?.visibilityState === 'visible') void this.syncNow();
    };
    win?.addEventListener('online', onOnline);
    doc?.addEventListener('visibilitychange', onVisible);
    this.cleanups.push(
      () => win?.removeEventListener('online', onOnline),
      () => doc?.removeEventListener('visibilitychange', onVisible),
      this.db.onMutation(() => this.requestSoon()),
    );
    void this.syncNow();
  }

  /** Stops listening and scheduling; answers when a run in progress has finished. */
  async stop(): Promise<void> {
    this.stopped = true;
    for (const cleanup of this.cleanups.splice(0)) cleanup();
    this.clearTimers();
    this.setState({ nextAttemptAt: null });
    await this.running?.catch(() => undefined);
  }

  /** A sync soon, gathering the changes made in the meantime into one push. */
  requestSoon(): void {
    if (this.stopped) return;
    if (this.debounce !== null) clearTimeout(this.debounce);
    this.debounce = setTimeout(() => {
      this.debounce = null;
      void this.syncNow();
    }, this.opts.debounceMs);
  }

  /** Syncs now (or joins the run in progress and runs once more after it). True when it went through. */
  syncNow(): Promise<boolean> {
    if (this.stopped) return Promise.resolve(false);
    if (this.running) {
      this.again = true;
      return this.running;
    }
    this.running = this.loop().finally(() => {
      this.running = null;
      // Asked for in the moment between the last round and here: one more run.
      if (this.again && !this.stopped) {
        this.again = false;
        void this.syncNow();
      }
    });
    return this.running;
  }

  /** The wait before the next try after `failures` failures in a row. */
  backoffMs(failures: number): number {
    const { minBackoffMs, maxBackoffMs, random } = this.opts;
    const full = Math.min(maxBackoffMs, minBackoffMs * 2 ** Math.max(0, failures - 1));
    return Math.round(full / 2 + (full / 2) * random());
  }

  private async loop(): Promise<boolean> {
    let ok: boolean;
    let rounds = 0;
    // A request made during a run (a change, coming online) gets a run of its own after it;
    // a few rounds at most, so a burst of requests against a failing server cannot spin.
    do {
      this.again = false;
      ok = await this.attempt();
      rounds += 1;
    } while (this.again && !this.stopped && rounds < 4);
    if (!this.stopped) {
      this.schedule(ok ? this.opts.intervalMs : this.backoffMs(this.state.failures));
    }
    return ok;
  }

  private async attempt(): Promise<boolean> {
    this.clearTimers();
    this.setState({ nextAttemptAt: null });
    if (!this.isOnline()) {
      this.setState({
        failures: this.state.failures + 1,
        lastError: describeSyncError(null),
        serverAway: false,
      });
      return false;
    }
    this.setState({ syncing: true });
    try {
      await this.lock(() => this.cycle());
      this.setState({ syncing: false, failures: 0, lastError: null, serverAway: false });
      return true;
    } catch (error) {
      // The outbox is untouched (a push's answer is applied only when it comes); the loop
      // schedules the next try with backoff.
      const online = this.isOnline();
      this.setState({
        syncing: false,
        failures: this.state.failures + 1,
        lastError: describeSyncError(error, online),
        serverAway: online && isServerAway(error),
      });
      return false;
    }
  }

  private async cycle(): Promise<void> {
    const clientId = await this.db.getMeta('clientId');
    // Images first: the server refuses a photo.attach whose image it does not have. One that
    // cannot go up now holds back only the mutations from the first one pointing at it.
    let uploadError: Error | null = null;
    try {
      await this.uploadBlobs();
    } catch (error) {
      uploadError = error instanceof Error ? error : new Error(String(error));
    }
    await this.push(clientId);
    await this.pull(clientId);
    if (uploadError) throw uploadError;
  }

  private async uploadBlobs(): Promise<void> {
    const waiting = await this.db.blobs.where('state').equals('pending').primaryKeys();
    for (const sha256 of waiting) {
      const blob = await this.db.blobs.get(sha256);
      if (!blob || blob.state !== 'pending') continue;
      // Whole records are put back: Dexie's update() deep-clones, and a clone must never
      // touch the image bytes.
      try {
        await this.transport.putBlob(sha256, blob.data, blob.mime);
        await this.db.blobs.put({ ...blob, state: 'uploaded', lastError: null });
      } catch (error) {
        const refused = isRefusedForGood(error);
        await this.db.blobs.put({
          ...blob,
          tries: blob.tries + 1,
          lastError: error instanceof Error ? error.message : String(error),
          ...(refused ? { state: 'refused' as const } : {}),
        });
        // Refused for good: the mutation goes anyway and the server's refusal shows up
        // among the rejected ones, where the user can see it. Otherwise: try later.
        if (!refused) throw error;
      }
    }
  }

  /** The outbox from the start up to the first mutation whose image is still waiting. */
  private async sendable(): Promise<OutboxEntry[]> {
    const head = await this.db.outbox.orderBy('id').limit(this.opts.pushBatch).toArray();
    const out: OutboxEntry[] = [];
    for (const m of head) {
      for (const sha of blobsReferenced(m.name, m.args)) {
        const blob = await this.db.blobs.get(sha);
        if (blob?.state === 'pending') return out;
      }
      out.push(m);
    }
    return out;
  }

  private async push(clientId: string): Promise<void> {
    for (;;) {
      const batch = await this.sendable();
      if (!batch.length) return;
      const mutations: Mutation[] = batch.map(({ id, name, args, createdAt }) => ({
        id,
        name,
        args,
        createdAt,
      }));
      const sentAt = this.db.now();
      const response = await this.transport.push({ clientId, mutations });
      const offset = offsetFrom(response.serverTime, sentAt, this.db.now());
      await applyPushResult(this.db, batch, response, offset);
      const lastSent = batch[batch.length - 1]!.id;
      if (response.lastMutationId < lastSent) {
        throw new Error('The server took only part of the changes; the rest go next time');
      }
    }
  }

  private async pull(clientId: string): Promise<void> {
    let cursor = await this.db.getMeta('cursor');
    let scope = await this.db.getMeta('scope');
    let pulled: PulledChanges | null = null;
    let sentAt = this.db.now();
    let receivedAt = sentAt;
    let more = false;
    for (let page = 0; page < this.opts.maxPullPages; page++) {
      sentAt = this.db.now();
      // Pages of 2,500 rows a table: a year's first pull is about 30 round trips, not 90.
      const response = await this.transport.pull({
        cursor,
        scope,
        clientId,
        limit: PULL_PAGE_ROWS,
      });
      receivedAt = this.db.now();
      pulled = mergePage(pulled, response);
      cursor = response.cursor;
      scope = response.scope;
      more = response.more;
      if (!more) break;
    }
    if (!pulled) return;
    await applyPull(this.db, pulled, offsetFrom(pulled.serverTime, sentAt, receivedAt));
    // A very long catch-up: apply what came, carry on in the next run.
    if (more) this.again = true;
  }

  private schedule(delayMs: number): void {
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = setTimeout(() => {
      this.timer = null;
      void this.syncNow();
    }, delayMs);
    this.setState({ nextAttemptAt: this.db.now() + delayMs });
  }

  private clearTimers(): void {
    if (this.timer !== null) clearTimeout(this.timer);
    this.timer = null;
    if (this.stopped && this.debounce !== null) {
      clearTimeout(this.debounce);
      this.debounce = null;
    }
  }

  private setState(patch: Partial<SyncEngineState>): void {
    this.state = { ...this.state, ...patch };
    for (const listener of this.listeners) listener();
  }
}

/** Server clock minus this phone's, taking the answer as made halfway through the call. */
export function offsetFrom(serverTime: number, sentAt: number, receivedAt: number): number {
  return Math.round(serverTime - (sentAt + receivedAt) / 2);
}

/** An upload the server will never take as it is (wrong hash, not an image, too large). */
function isRefusedForGood(error: unknown): boolean {
  if (!isApiError(error)) return false;
  if (error.code === 'blob-unreadable') return false;
  return [400, 413, 415, 422].includes(error.status);
}

/** The server did not answer, or said it cannot work just now (a gateway's or its own 503). */
export function isServerAway(error: unknown): boolean {
  return isNetworkError(error) || (isApiError(error) && [502, 503, 504].includes(error.status));
}

export const SERVER_AWAY_WORDS =
  'The Panelpass server cannot be reached just now: changes wait on this phone and go by themselves when it is back.';

/** Why a sync did not go through, in the detailer's words (never an error code). */
export function describeSyncError(error: unknown, online = false): string {
  if (error === null || (isNetworkError(error) && !online)) {
    return 'No signal: changes wait on this phone.';
  }
  if (isServerAway(error)) return SERVER_AWAY_WORDS;
  if (isQuotaError(error)) return OUT_OF_SPACE_MESSAGE;
  if (isApiError(error, 401)) return 'Signed out on the server: sign in again to send changes.';
  if (isApiError(error) && error.status >= 500) {
    return 'The Panelpass server had a problem; trying again shortly.';
  }
  if (error instanceof Error) return error.message;
  return 'Sync did not go through; trying again shortly.';
}
