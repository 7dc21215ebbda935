import { useLiveQuery } from 'dexie-react-hooks';
import { useEffect, useRef, useState } from 'react';
import type { PhotoRow } from '@panelpass/shared';
import { isApiError, isNetworkError } from '../../api/errors';
import { apiClient, sessionStore } from '../../app/services';
import { useOnline } from '../../app/useOnline';
import { fetchImage, touch, type BlobDownloader, type ImageBytes } from '../../db/blobCache';
import { useLocalDb } from '../../db/hooks';
import { createImageDownloader } from './downloadImage';

export type PhotoKind = 'before' | 'after' | 'damage' | 'other';

/** Which of a job's photos to show: by kind(s) and/or by what they show (a pin, a panel…). */
export interface PhotoFilter {
  kinds?: readonly PhotoKind[];
  subjectType?: string | null;
  subjectId?: string | null;
}

/** Photos of a job matching the filter, oldest first (undefined while loading). */
export function useJobPhotos(
  jobId: string | null | undefined,
  filter: PhotoFilter = {},
): PhotoRow[] | undefined {
  const db = useLocalDb();
  const kinds = filter.kinds?.join(',') ?? '';
  const { subjectType, subjectId } = filter;
  return useLiveQuery(async () => {
    if (!db || !jobId) return [];
    const rows = await db.rows('photos').where('jobId').equals(jobId).toArray();
    return selectPhotos(rows, {
      ...(kinds ? { kinds: kinds.split(',') as PhotoKind[] } : {}),
      ...(subjectType !== undefined ? { subjectType } : {}),
      ...(subjectId !== undefined ? { subjectId } : {}),
    });
  }, [db, jobId, kinds, subjectType, subjectId]);
}

/** The filter and order of useJobPhotos, pure. */
export function selectPhotos(rows: readonly PhotoRow[], filter: PhotoFilter): PhotoRow[] {
  return rows
    .filter((p) => !filter.kinds || filter.kinds.includes(p.kind as PhotoKind))
    .filter((p) => filter.subjectType === undefined || p.subjectType === filter.subjectType)
    .filter((p) => filter.subjectId === undefined || p.subjectId === filter.subjectId)
    .sort((a, b) => a.takenAt.localeCompare(b.takenAt) || a.id.localeCompare(b.id));
}

/**
 * Where an image stands on this phone: `loading` (looking or downloading), `ready` (url),
 * `offline` (on the server, no signal now), `missing` (the server has no such image for this
 * user), `error` (any other failure, e.g. bytes that did not match the fingerprint).
 */
export type ImageStatus = 'loading' | 'ready' | 'offline' | 'missing' | 'error';

export interface ImageView {
  status: ImageStatus;
  /** An object URL while `ready`, freed when no longer shown; null otherwise. */
  url: string | null;
}

type Fetched = { sha256: string } & (
  { bytes: ImageBytes; status: 'ready' } | { bytes: null; status: 'offline' | 'missing' | 'error' }
);

let appDownloader: BlobDownloader | null = null;
function downloader(): BlobDownloader {
  appDownloader ??= createImageDownloader({ api: apiClient, sessionStore });
  return appDownloader;
}

/** What a failed download means for the screen. */
export function imageFailure(error: unknown): 'offline' | 'missing' | 'error' {
  if (isNetworkError(error)) return 'offline';
  if (isApiError(error, 404)) return 'missing';
  return 'error';
}

/**
 * A photo or signature image by its SHA-256: this phone's copy when it has one (made here or
 * downloaded before), else — with signal — downloaded from the server, checked against the
 * SHA-256 and kept as a downloaded copy (db/blobCache.ts). Screens showing the same image
 * at once share one download; with no signal it says `offline` and tries again once the
 * signal is back.
 */
export function useImage(sha256: string | null | undefined): ImageView {
  const db = useLocalDb();
  const online = useOnline();
  const stored = useLiveQuery(async () => {
    if (!db || !sha256) return null;
    const blob = await db.blobs.get(sha256);
    return blob ? { data: blob.data, mime: blob.mime, state: blob.state } : null;
  }, [db, sha256]);
  const [fetched, setFetched] = useState<Fetched | null>(null);
  const absent = stored === null;

  // Bytes already downloaded by this screen are shown from memory even if the copy was
  // evicted meanwhile: never download the same image again in a loop.
  const held = useRef<string | null>(null);

  useEffect(() => {
    if (!db || !sha256 || !absent || held.current === sha256) return;
    if (!online) {
      setFetched({ sha256, bytes: null, status: 'offline' });
      return;
    }
    let live = true;
    setFetched(null);
    fetchImage(db, sha256, downloader()).then(
      (bytes) => {
        if (!live) return;
        held.current = sha256;
        setFetched({ sha256, bytes, status: 'ready' });
      },
      (error: unknown) => {
        if (live) setFetched({ sha256, bytes: null, status: imageFailure(error) });
      },
    );
    return () => {
      live = false;
    };
  }, [db, sha256, absent, online]);

  // A downloaded copy shown again is the last to be evicted.
  const storedState = stored?.state;
  useEffect(() => {
    if (db && sha256 && (storedState as string) === 'downloaded') void touch(db, sha256);
  }, [db, sha256, storedState]);

  const mine = fetched?.sha256 === sha256 ? fetched : null;
  const source: ImageBytes | null = stored ?? mine?.bytes ?? null;
  const [url, setUrl] = useState<string | null>(null);
  // A re-run of the query (an upload changed the blob's state) brings the same bytes: make
  // a new URL only when the image itself changes.
  const latest = useRef(source);
  latest.current = source;
  const key = source ? sha256 : null;
  useEffect(() => {
    const current = latest.current;
    if (!current) {
      setUrl(null);
      return;
    }
    const made = URL.createObjectURL(new Blob([current.data], { type: current.mime }));
    setUrl(made);
    return () => URL.revokeObjectURL(made);
  }, [key]);

  // Outside the signed-in shell there is no phone database to look in.
  if (!sha256 || !db) return { status: 'missing', url: null };
  if (source) return url ? { status: 'ready', url } : { status: 'loading', url: null };
  if (stored === undefined || !mine) return { status: 'loading', url: null };
  return { status: mine.status === 'ready' ? 'loading' : mine.status, url: null };
}

/**
 * An object URL for an image (photo or signature, by SHA-256), downloaded from the server
 * when another phone made it: undefined while looking or downloading, null when it cannot be
 * shown now (no signal, not on the server). See useImage for the reason.
 */
export function useImageUrl(sha256: string | null | undefined): string | null | undefined {
  const { status, url } = useImage(sha256);
  if (status === 'loading') return undefined;
  return url;
}
