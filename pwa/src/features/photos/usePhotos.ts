import { useLiveQuery } from 'dexie-react-hooks';
import { useEffect, useRef, useState } from 'react';
import type { PhotoRow } from '@panelpass/shared';
import { useLocalDb } from '../../db/hooks';

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
 * An object URL for an image kept on this phone (photo or signature, by SHA-256): undefined
 * while looking, null when the phone does not hold it (taken on another phone: it is on the
 * server). The URL is freed when no longer shown.
 */
export function useImageUrl(sha256: string | null | undefined): string | null | undefined {
  const db = useLocalDb();
  const stored = useLiveQuery(async () => {
    if (!db || !sha256) return null;
    const blob = await db.blobs.get(sha256);
    return blob ? { data: blob.data, mime: blob.mime } : null;
  }, [db, sha256]);
  const [url, setUrl] = useState<string | null | undefined>(undefined);
  // A re-run of the query (an upload changed the blob's state) brings the same bytes: make
  // a new URL only when the image itself changes.
  const latest = useRef(stored);
  latest.current = stored;
  const key = stored ? `${sha256}` : stored;
  useEffect(() => {
    const current = latest.current;
    if (!current) {
      setUrl(current);
      return;
    }
    const made = URL.createObjectURL(new Blob([current.data], { type: current.mime }));
    setUrl(made);
    return () => URL.revokeObjectURL(made);
  }, [key]);
  return url;
}
