import type { Table } from 'dexie';
import { sha256Hex } from './images';
import type { LocalDb, StoredBlob } from './localDb';

/**
 * Images made on another phone, fetched on demand and kept here as *downloaded copies*.
 *
 * A downloaded copy sits in the `blobs` store beside this phone's own images, with the state
 * `downloaded`: the upload queue only ever sends `pending` images, so it never sends one back.
 * Downloaded copies are a cache: their sizes and last use are kept in `blob_cache`, and once
 * they add up to more than the cap the least recently shown go first. This phone's own
 * images (pending, uploaded, refused) are never evicted.
 */

/** What the downloaded copies may take together (this phone's own images do not count). */
export const DOWNLOAD_CAP_BYTES = 150 * 1024 * 1024;

export type CachedBlobState = StoredBlob['state'] | 'downloaded';

/** A row of the `blobs` store as this module sees it: the sync's states plus `downloaded`. */
export type CachedBlob = Omit<StoredBlob, 'state'> & { state: CachedBlobState };

/** One downloaded copy's bookkeeping (the bytes stay in `blobs`). */
export interface BlobCacheEntry {
  sha256: string;
  size: number;
  /** Device clock, epoch ms: when the image was last shown. */
  lastUsedAt: number;
}

export interface ImageBytes {
  data: ArrayBuffer;
  mime: string;
}

/** Fetches an image's bytes from the server by its SHA-256 (throws as the API client does). */
export type BlobDownloader = (sha256: string, signal?: AbortSignal) => Promise<ImageBytes>;

/** The server sent bytes whose SHA-256 is not the one asked for: refused, nothing kept. */
export class ImageHashMismatchError extends Error {
  constructor(
    readonly expected: string,
    readonly actual: string,
  ) {
    super('The image from the server does not match its fingerprint; it was not kept');
    this.name = 'ImageHashMismatchError';
  }
}

function blobsTable(db: LocalDb): Table<CachedBlob, string> {
  return db.table<CachedBlob, string>('blobs');
}

function cacheTable(db: LocalDb): Table<BlobCacheEntry, string> {
  return db.table<BlobCacheEntry, string>('blob_cache');
}

/** The image if this phone holds it (its own or a downloaded copy), marking a copy as used. */
export async function localImage(db: LocalDb, sha256: string): Promise<ImageBytes | null> {
  const blob = await blobsTable(db).get(sha256);
  if (!blob) return null;
  if (blob.state === 'downloaded') await touch(db, sha256);
  return { data: blob.data, mime: blob.mime };
}

/** Marks a downloaded copy as just shown (the last to be evicted). */
export async function touch(db: LocalDb, sha256: string): Promise<void> {
  await cacheTable(db).update(sha256, { lastUsedAt: db.now() });
}

const inFlight = new WeakMap<LocalDb, Map<string, Promise<ImageBytes>>>();

export interface FetchImageOptions {
  capBytes?: number;
}

/**
 * The image by its SHA-256: this phone's copy when it has one, else downloaded, checked
 * against its SHA-256 and kept as a downloaded copy. Several callers asking for the same
 * image at once share one download.
 */
export async function fetchImage(
  db: LocalDb,
  sha256: string,
  download: BlobDownloader,
  options: FetchImageOptions = {},
): Promise<ImageBytes> {
  const local = await localImage(db, sha256);
  if (local) return local;
  let running = inFlight.get(db);
  if (!running) {
    running = new Map();
    inFlight.set(db, running);
  }
  const existing = running.get(sha256);
  if (existing) return existing;
  const map = running;
  const work = downloadAndKeep(db, sha256, download, options.capBytes ?? DOWNLOAD_CAP_BYTES);
  map.set(sha256, work);
  try {
    return await work;
  } finally {
    map.delete(sha256);
  }
}

async function downloadAndKeep(
  db: LocalDb,
  sha256: string,
  download: BlobDownloader,
  capBytes: number,
): Promise<ImageBytes> {
  const { data, mime } = await download(sha256);
  const actual = await sha256Hex(data);
  if (actual !== sha256) throw new ImageHashMismatchError(sha256, actual);
  await keepDownloaded(db, sha256, data, mime);
  await evictDownloaded(db, capBytes);
  return { data, mime };
}

/** Keeps checked bytes as a downloaded copy, unless the phone already holds the image. */
async function keepDownloaded(
  db: LocalDb,
  sha256: string,
  data: ArrayBuffer,
  mime: string,
): Promise<void> {
  const blobs = blobsTable(db);
  const cache = cacheTable(db);
  await db.transaction('rw', blobs, cache, async () => {
    // Taken again on this phone meanwhile (the same bytes): its own copy wins.
    if (await blobs.get(sha256)) return;
    await blobs.add({
      sha256,
      mime,
      data,
      size: data.byteLength,
      state: 'downloaded',
      tries: 0,
      lastError: null,
      createdAt: new Date(db.now()).toISOString(),
    });
    await cache.put({ sha256, size: data.byteLength, lastUsedAt: db.now() });
  });
}

/**
 * Drops the least recently shown downloaded copies until they take at most `capBytes`.
 * Only copies still in the `downloaded` state go: an image this phone made (waiting to
 * upload or not) is never dropped. Answers the hashes evicted, oldest first.
 */
export async function evictDownloaded(
  db: LocalDb,
  capBytes: number = DOWNLOAD_CAP_BYTES,
): Promise<string[]> {
  const blobs = blobsTable(db);
  const cache = cacheTable(db);
  return db.transaction('rw', blobs, cache, async () => {
    const entries = await cache.orderBy('lastUsedAt').toArray();
    let total = entries.reduce((sum, e) => sum + e.size, 0);
    // Which rows are copies, read from the state index alone (no image bytes loaded).
    const copies = new Set(await blobs.where('state').equals('downloaded').primaryKeys());
    const evicted: string[] = [];
    for (const entry of entries) {
      if (total <= capBytes) break;
      await cache.delete(entry.sha256);
      total -= entry.size;
      if (!copies.has(entry.sha256)) continue;
      await blobs.delete(entry.sha256);
      evicted.push(entry.sha256);
    }
    return evicted;
  });
}

/** What the downloaded copies take now, in bytes. */
export async function downloadedBytes(db: LocalDb): Promise<number> {
  let total = 0;
  await cacheTable(db).each((e) => {
    total += e.size;
  });
  return total;
}
