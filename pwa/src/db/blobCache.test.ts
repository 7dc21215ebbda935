import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from '../api/errors';
import { createApiClient } from '../api/client';
import { createSessionStore } from '../features/auth/model/sessionStore';
import { createImageDownloader } from '../features/photos/downloadImage';
import { imageFailure } from '../features/photos/usePhotos';
import { freshIndexedDb, openTestDb, T0 } from '../test/localDb';
import { MemoryStorage } from '../test/memoryStorage';
import { aSession, json } from '../test/sessions';
import {
  downloadedBytes,
  evictDownloaded,
  fetchImage,
  ImageHashMismatchError,
  touch,
  type BlobDownloader,
  type CachedBlob,
} from './blobCache';
import { sha256Hex } from './images';
import type { LocalDb } from './localDb';

const opened: LocalDb[] = [];
afterEach(() => {
  for (const db of opened.splice(0)) db.close();
});

function open(clock = { now: T0 }): LocalDb {
  const db = openTestDb(freshIndexedDb(), undefined, { now: () => clock.now });
  opened.push(db);
  return db;
}

function bytesOf(text: string, size = 0): ArrayBuffer {
  const head = new TextEncoder().encode(text);
  const out = new Uint8Array(Math.max(size, head.byteLength));
  out.set(head);
  return out.buffer;
}

/** A server holding these images: answers like GET /api/blobs/:sha256 through the client. */
async function serverOf(...images: ArrayBuffer[]) {
  const held = new Map<string, ArrayBuffer>();
  for (const image of images) held.set(await sha256Hex(image), image);
  const download = vi.fn<BlobDownloader>((sha) => {
    const data = held.get(sha);
    if (!data) return Promise.reject(new ApiError(404, 'not-found', 'No such image'));
    return Promise.resolve({ data: data.slice(0), mime: 'image/jpeg' });
  });
  return { download, held };
}

/** An image taken on this phone, waiting for its upload (as mutate() keeps it). */
async function keepOwn(db: LocalDb, data: ArrayBuffer): Promise<void> {
  await db.blobs.add({
    sha256: await sha256Hex(data),
    mime: 'image/jpeg',
    data,
    size: data.byteLength,
    state: 'pending',
    tries: 0,
    lastError: null,
    createdAt: new Date(T0).toISOString(),
  });
}

async function stateOf(db: LocalDb, sha: string): Promise<string | undefined> {
  return (await db.table<CachedBlob, string>('blobs').get(sha))?.state;
}

describe('downloaded copies of images made on another phone', () => {
  it('answers the copy the phone holds without asking the server (a cache hit)', async () => {
    const db = open();
    const data = bytesOf('taken here');
    await keepOwn(db, data);
    const { download } = await serverOf();
    const got = await fetchImage(db, await sha256Hex(data), download);
    expect(new Uint8Array(got.data)).toEqual(new Uint8Array(data));
    expect(download).not.toHaveBeenCalled();
  });

  it('downloads once, keeps it as a downloaded copy the upload queue never sends', async () => {
    const db = open();
    const image = bytesOf('from the other phone');
    const sha = await sha256Hex(image);
    const { download } = await serverOf(image);

    const first = await fetchImage(db, sha, download);
    expect(new Uint8Array(first.data)).toEqual(new Uint8Array(image));
    expect(await stateOf(db, sha)).toBe('downloaded');
    // The sync uploads only `pending` images.
    expect(await db.blobs.where('state').equals('pending').count()).toBe(0);

    await fetchImage(db, sha, download);
    expect(download).toHaveBeenCalledTimes(1);
  });

  it('shares one download among callers asking for the same image at once', async () => {
    const db = open();
    const image = bytesOf('asked twice');
    const sha = await sha256Hex(image);
    const { download } = await serverOf(image);
    const [a, b] = await Promise.all([
      fetchImage(db, sha, download),
      fetchImage(db, sha, download),
    ]);
    expect(download).toHaveBeenCalledTimes(1);
    expect(a.data.byteLength).toBe(b.data.byteLength);
  });

  it('refuses bytes that do not match the SHA-256 asked for, and keeps nothing', async () => {
    const db = open();
    const asked = await sha256Hex(bytesOf('the real photo'));
    const download = vi.fn<BlobDownloader>(() =>
      Promise.resolve({ data: bytesOf('something else'), mime: 'image/jpeg' }),
    );
    const failed = fetchImage(db, asked, download);
    await expect(failed).rejects.toBeInstanceOf(ImageHashMismatchError);
    await expect(failed.catch(imageFailure)).resolves.toBe('error');
    expect(await db.blobs.get(asked)).toBeUndefined();
    expect(await downloadedBytes(db)).toBe(0);
  });

  it('passes on the server’s 404 (shown as not on the server) and keeps nothing', async () => {
    const db = open();
    const sha = await sha256Hex(bytesOf('never uploaded'));
    const { download } = await serverOf();
    const failed = fetchImage(db, sha, download);
    await expect(failed).rejects.toMatchObject({ status: 404 });
    await expect(failed.catch(imageFailure)).resolves.toBe('missing');
    expect(await db.blobs.get(sha)).toBeUndefined();
  });

  it('evicts the least recently shown copies first and never an image not yet uploaded', async () => {
    const clock = { now: T0 };
    const db = open(clock);
    // This phone's own photo, waiting to upload: large, yet never evicted.
    const own = bytesOf('own', 400);
    await keepOwn(db, own);
    const ownSha = await sha256Hex(own);
    const copies = [bytesOf('a', 100), bytesOf('b', 100), bytesOf('c', 100)];
    const [a, b, c] = await Promise.all(copies.map((x) => sha256Hex(x)));
    const { download } = await serverOf(...copies);
    const cap = { capBytes: 250 };
    for (const sha of [a, b]) {
      clock.now += 1000;
      await fetchImage(db, sha!, download, cap);
    }
    // a shown again: b is now the least recently shown.
    clock.now += 1000;
    await touch(db, a!);
    clock.now += 1000;
    await fetchImage(db, c!, download, cap);

    expect(await db.blobs.get(b!)).toBeUndefined();
    expect(await stateOf(db, a!)).toBe('downloaded');
    expect(await stateOf(db, c!)).toBe('downloaded');
    expect(await stateOf(db, ownSha)).toBe('pending');
    expect(await downloadedBytes(db)).toBe(200);

    // Even a cap of nothing leaves the phone's own image.
    expect(await evictDownloaded(db, 0)).toEqual([a, c]);
    expect(await stateOf(db, ownSha)).toBe('pending');
    expect(await db.blobs.count()).toBe(1);
  });
});

describe('createImageDownloader: GET /api/blobs/:sha256 with the session', () => {
  function setUp(fetchImpl: typeof fetch) {
    const sessionStore = createSessionStore(new MemoryStorage());
    sessionStore.set(aSession());
    const api = createApiClient({ sessionStore, fetch: fetchImpl, lock: (w) => w() });
    return createImageDownloader({ api, sessionStore, fetch: fetchImpl });
  }

  it('sends the bearer token and answers the bytes with their type', async () => {
    const fetchImpl = vi.fn<typeof fetch>(() =>
      Promise.resolve(
        new Response(new Uint8Array([1, 2, 3]), { headers: { 'Content-Type': 'image/png' } }),
      ),
    );
    const got = await setUp(fetchImpl)('ab'.repeat(32));
    expect(got.mime).toBe('image/png');
    expect(new Uint8Array(got.data)).toEqual(new Uint8Array([1, 2, 3]));
    const [url, init] = fetchImpl.mock.calls[0]!;
    expect(url).toBe(`/api/blobs/${'ab'.repeat(32)}`);
    expect((init?.headers as Record<string, string>).Authorization).toBe('Bearer access-1');
  });

  it('turns a 404 into an ApiError and no answer into a NetworkError', async () => {
    const notFound = setUp(() =>
      Promise.resolve(json(404, { statusCode: 404, code: 'not-found', message: 'No image' })),
    );
    await expect(notFound('cd'.repeat(32))).rejects.toMatchObject({ status: 404 });
    const silent = setUp(() => Promise.reject(new TypeError('Failed to fetch')));
    const failed = silent('cd'.repeat(32));
    await expect(failed.catch(imageFailure)).resolves.toBe('offline');
  });
});
