import Dexie, { type Table } from 'dexie';
import {
  SYNC_TABLES,
  type Mutation,
  type RejectedMutation,
  type SyncRow,
  type SyncRowTypes,
  type SyncTable,
} from '@panelpass/shared';
import { SCHEMA_VERSIONS, type SchemaVersion, type StoreSpec } from './schema';
import { localDbName } from './localDbName';

/** A recorded mutation waiting for the server; `at` is when it was made, on the server's clock. */
export interface OutboxEntry extends Mutation {
  at: number;
}

export type BlobState = 'pending' | 'uploaded' | 'refused';

/**
 * A photo or signature image. The bytes stay here until the server confirms the upload (and
 * after, so the picture still shows offline). ArrayBuffer rather than Blob: every browser
 * stores it, and older Safari could not store Blobs in IndexedDB.
 */
export interface StoredBlob {
  sha256: string;
  mime: string;
  data: ArrayBuffer;
  size: number;
  state: BlobState;
  tries: number;
  lastError: string | null;
  createdAt: string;
}

/** The server's copy of a row a pending mutation changed; null when the server has none. */
export interface BaseEntry {
  key: string;
  table: SyncTable;
  id: string;
  row: SyncRow | null;
}

export interface MetaValues {
  clientId: string;
  userId: string;
  businessId: string;
  /** The next pull asks for rows with a version above this (a server number, never a clock). */
  cursor: number;
  /** The highest mutation id the server has dealt with (applied or rejected). */
  lastMutationId: number;
  /** The id the next mutation gets: never reused, never skipped. */
  nextMutationId: number;
  /** Server time (epoch ms) of the last complete sync. */
  lastSyncAt: number | null;
  /** Server clock minus this phone's clock, from the last answers (ms). */
  serverOffsetMs: number;
  /** Persistent storage was asked for once. */
  persistAsked: boolean;
  /** The server's scope number of the last pull (what this person may see); 0 at first. */
  scope: number;
}

/**
 * What a new database starts with, besides who it belongs to; also the value of a key added
 * after a database was first made (meta is key/value: no migration).
 */
const META_DEFAULTS: Omit<MetaValues, 'clientId' | 'userId' | 'businessId'> = {
  cursor: 0,
  lastMutationId: 0,
  nextMutationId: 1,
  lastSyncAt: null,
  serverOffsetMs: 0,
  persistAsked: false,
  scope: 0,
};

export type MetaKey = keyof MetaValues;

export interface MetaEntry {
  key: MetaKey;
  value: MetaValues[MetaKey];
}

export type Role = 'owner' | 'tech' | 'customer';

/** Whose copy this database is: one database per signed-in user. */
export interface DbOwner {
  userId: string;
  businessId: string;
  role: Role;
}

export interface LocalDbOptions {
  /** fake-indexeddb in tests; the browser's otherwise. */
  indexedDB?: IDBFactory;
  IDBKeyRange?: typeof IDBKeyRange;
  /** This phone's clock (epoch ms). */
  now?: () => number;
  /** Another tab upgraded or deleted this database: after closing it (default: reload the page). */
  onVersionChange?: () => void;
  /** Only the schema versions up to this one (upgrade tests). */
  upToVersion?: number;
}

export { localDbName };

/**
 * Declares the schema on a Dexie instance: the latest version with every version's stores
 * merged, and before it only the versions that rewrite rows (an `upgrade`). Dexie (3 and later)
 * reads the installed schema from the database itself and adds or drops stores and indexes to
 * match, so a phone on any older version still upgrades; declaring each version made Dexie
 * parse the whole schema once per version on every start (about 6 ms of the first screen's
 * longest task, unthrottled).
 */
export function declareSchema(db: Dexie, versions: readonly SchemaVersion[]): void {
  let stores: StoreSpec = {};
  for (const v of versions) {
    stores = { ...stores, ...v.stores };
    if (v.upgrade) db.version(v.version).stores(stores).upgrade(v.upgrade);
  }
  // Versions are numbered 1, 2, 3… (schema.test.ts): the last is the list's length.
  db.version(versions.length).stores(stores);
}

/** The phone's working copy of one user's business data, its outbox and sync state. */
export class LocalDb extends Dexie {
  outbox!: Table<OutboxEntry, number>;
  rejected!: Table<RejectedMutation, number>;
  meta!: Table<MetaEntry, MetaKey>;
  blobs!: Table<StoredBlob, string>;
  base!: Table<BaseEntry, string>;

  readonly owner: DbOwner;
  readonly now: () => number;
  private readonly mutationListeners = new Set<() => void>();

  constructor(owner: DbOwner, options: LocalDbOptions = {}) {
    super(localDbName(owner.userId), {
      ...(options.indexedDB ? { indexedDB: options.indexedDB } : {}),
      ...(options.IDBKeyRange ? { IDBKeyRange: options.IDBKeyRange } : {}),
    });
    this.owner = owner;
    this.now = options.now ?? (() => Date.now());
    // Versions are numbered 1, 2, 3…: the first `upToVersion` of them (all when not given).
    declareSchema(this, SCHEMA_VERSIONS.slice(0, options.upToVersion));
    this.on('populate', (tx) => {
      const initial: MetaValues = {
        ...META_DEFAULTS,
        clientId: crypto.randomUUID(),
        userId: owner.userId,
        businessId: owner.businessId,
      };
      const entries = Object.entries(initial).map(([key, value]): MetaEntry => ({
        key: key as MetaKey,
        value: value as MetaValues[MetaKey],
      }));
      return tx.table<MetaEntry, MetaKey>('meta').bulkAdd(entries);
    });
    // Another tab opened a newer schema (an update) or deleted this database (signed out):
    // this page's code no longer matches, so let go at once and start again.
    const onVersionChange = options.onVersionChange ?? (() => window.location.reload());
    this.on('versionchange', () => {
      this.close();
      onVersionChange();
      return false;
    });
  }

  /** A synced table, typed by its rows. */
  rows<T extends SyncTable>(table: T): Table<SyncRowTypes[T], string> {
    return this.table(table);
  }

  /** Every table a mutation or a pull may write. */
  get writeScope(): Table[] {
    return [
      ...SYNC_TABLES.map((t) => this.table(t)),
      this.outbox,
      this.rejected,
      this.meta,
      this.blobs,
      this.base,
    ];
  }

  async getMeta<K extends MetaKey>(key: K): Promise<MetaValues[K]> {
    const entry = await this.meta.get(key);
    if (entry) return entry.value as MetaValues[K];
    if (key in META_DEFAULTS) return (META_DEFAULTS as Partial<MetaValues>)[key] as MetaValues[K];
    throw new Error(`The local database has no ${key}`);
  }

  async setMeta<K extends MetaKey>(key: K, value: MetaValues[K]): Promise<void> {
    await this.meta.put({ key, value });
  }

  /** Now on the server's clock, as well as this phone knows it. */
  async serverNow(): Promise<number> {
    return this.now() + (await this.getMeta('serverOffsetMs'));
  }

  /** Called after each mutation is stored (the sync engine sends soon after). */
  onMutation(listener: () => void): () => void {
    this.mutationListeners.add(listener);
    return () => this.mutationListeners.delete(listener);
  }

  notifyMutation(): void {
    for (const listener of this.mutationListeners) listener();
  }
}
