/**
 * The sync protocol between a device and the server (see docs/sync.md).
 *
 * A device numbers its mutations 1, 2, 3… per `clientId`. A mutation is a named domain
 * command with its arguments — the same names and arguments the REST API runs through the
 * server's command bus. The server applies pushed mutations in order, exactly once, and
 * answers pulls with every row the caller may see whose `version` is above the cursor.
 */

/** Every table a device keeps a copy of, in the order a pull applies them (parents first). */
export const SYNC_TABLES = [
  'customers',
  'vehicles',
  'products',
  'quotes',
  'quote_lines',
  'jobs',
  'job_panels',
  'checklist_items',
  'damage_pins',
  'film_readings',
  'correction_passes',
  'chips',
  'chip_layers',
  'solvent_applications',
  'masking_items',
  'timers',
  'climate_readings',
  'photos',
  'signatures',
  'payments',
  'invoices',
  'stock_movements',
] as const;
export type SyncTable = (typeof SYNC_TABLES)[number];

/** A synced row as JSON: camelCase fields, ISO dates, `version`, and `deletedAt` as tombstone. */
export interface SyncRow {
  id: string;
  businessId: string;
  version: number;
  deletedAt: string | null;
  [field: string]: unknown;
}

export interface Mutation {
  /** 1, 2, 3… per client, never reused. */
  id: number;
  /** A command name such as `pass.log`. */
  name: string;
  args: Record<string, unknown>;
  /** Device clock when made (for display only; the server orders). */
  createdAt: string;
}

export interface PushRequest {
  clientId: string;
  mutations: Mutation[];
}

export type MutationOutcome =
  | { id: number; status: 'applied' }
  | { id: number; status: 'skipped' }
  | { id: number; status: 'rejected'; code: string; message: string; details?: unknown };

export interface PushResponse {
  /** The highest mutation id of this client the server has dealt with (applied or rejected). */
  lastMutationId: number;
  results: MutationOutcome[];
  /** Server clock, epoch ms, for the device's clock offset (timers). */
  serverTime: number;
}

export interface PullResponse {
  /** Pass back as `cursor` on the next pull. */
  cursor: number;
  /** The caller's `lastMutationId` as of this pull: pending mutations above it still need a rebase. */
  lastMutationId: number;
  changes: Partial<Record<SyncTable, SyncRow[]>>;
  /** True when the server stopped at its page limit: pull again with the new cursor. */
  more: boolean;
  serverTime: number;
  /**
   * True when what the caller may see has changed (a helper was given or taken off a job):
   * the device must drop its synced tables (never the outbox) and keep what this pull sends,
   * pulling on while `more`. The server then counts from cursor 0.
   */
  reset: boolean;
  /** The caller's scope number; send it back as `scope` on the next pull. */
  scope: number;
}

/** Query of `GET /api/sync/pull`. */
export interface PullQuery {
  cursor: number;
  /** The `scope` of the last pull (0 at first). */
  scope: number;
  clientId: string;
  /** Rows per table in one page, 1–5000 (the server's default, 1000, when left out). */
  limit?: number;
}

/** Rows per table the app asks for in one pull page. */
export const PULL_PAGE_ROWS = 2500;

/** A rejected mutation as the device keeps it, to show the user and let them resolve it. */
export interface RejectedMutation extends Mutation {
  code: string;
  message: string;
  details?: unknown;
  rejectedAt: string;
}
