import type { SyncTable } from '@panelpass/shared';
import type { Transaction } from 'dexie';

/**
 * The Dexie schema, one entry per version. APPEND-ONLY: a shipped version runs on phones
 * that hold the only copy of a day's work, so it is never edited or removed — a change is a
 * new version below (schema.test.ts keeps version 1 as shipped), numbered 1, 2, 3… Each
 * entry lists only the stores it adds or changes (null drops one). Dexie is given the stores
 * merged up to the latest version, plus each version with an `upgrade` (localDb.ts,
 * `declareSchema`).
 *
 * Primary key first, then the indexes the screens read by. Booleans cannot be indexed in
 * IndexedDB, so states are strings.
 */
export type StoreSpec = Record<string, string | null>;

export interface SchemaVersion {
  version: number;
  stores: StoreSpec;
  /** Rewrites stored rows for this version, when the data changes shape (none so far). */
  upgrade?: (tx: Transaction) => Promise<void> | void;
}

const syncedV1: Record<SyncTable, string> = {
  customers: 'id, name',
  vehicles: 'id, customerId',
  products: 'id, kind',
  quotes: 'id, customerId',
  quote_lines: 'id, quoteId',
  jobs: 'id, windowStart, customerId, vehicleId, assignedTechId',
  job_panels: 'id, jobId, [jobId+position]',
  checklist_items: 'id, jobId, [jobId+position]',
  damage_pins: 'id, jobId',
  film_readings: 'id, jobId, panelId',
  correction_passes: 'id, jobId, panelId',
  chips: 'id, jobId, panelId',
  chip_layers: 'id, jobId, chipId',
  solvent_applications: 'id, jobId',
  masking_items: 'id, jobId',
  timers: 'id, jobId, subjectId',
  climate_readings: 'id, jobId, takenAt',
  photos: 'id, jobId, vehicleId, subjectId, sha256',
  signatures: 'id, jobId, quoteId',
  payments: 'id, jobId, opId',
  invoices: 'id, jobId',
  stock_movements: 'id, productId, jobId',
};

export const SCHEMA_VERSIONS: readonly SchemaVersion[] = [
  {
    version: 1,
    stores: {
      ...syncedV1,
      // Mutations not yet confirmed by the server, by mutation id (1, 2, 3…).
      outbox: 'id',
      // Mutations the server refused, kept with its reason until the user resolves them.
      rejected: 'id',
      // Key/value: clientId, pull cursor, mutation counters, last sync, clock offset.
      meta: 'key',
      // Photo and signature images by SHA-256, kept until the server confirms the upload.
      blobs: 'sha256, state',
      // The server's copy of each row a pending mutation changed (null: the server has none),
      // keyed "table/id": what a rebase resets to before re-applying the pending mutations.
      base: 'key',
    },
  },
  {
    // The Today screen lists running timers by end time and jobs by stage.
    version: 2,
    stores: {
      jobs: 'id, windowStart, customerId, vehicleId, assignedTechId, stage',
      timers: 'id, jobId, subjectId, endsAt',
    },
  },
  {
    // Images made on another phone, downloaded when shown: their size and last use, so the
    // least recently shown copies go first once they pass the cap (db/blobCache.ts).
    version: 3,
    stores: {
      blob_cache: 'sha256, lastUsedAt',
    },
  },
];
