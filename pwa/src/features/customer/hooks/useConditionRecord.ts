import { useQuery } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { apiClient, sessionStore } from '../../../app/services';
import { conditionRecordQuery, customerImageQuery } from '../api/customerApi';
import { recordHash as hashOfRecord } from '../../../db/hashing';

/** The walkaround record of a job, read only when `enabled` (its sheet is open). */
export function useConditionRecord(jobId: string, enabled: boolean) {
  return useQuery({ ...conditionRecordQuery(apiClient, jobId), enabled });
}

/** An image the customer may see, as an object URL for <img> (null until it has come). */
export function useCustomerImage(url: string | null): { src: string | null; failed: boolean } {
  const image = useQuery({
    ...customerImageQuery(apiClient, sessionStore, url ?? ''),
    enabled: url !== null,
  });
  const [src, setSrc] = useState<string | null>(null);
  useEffect(() => {
    if (!image.data) return;
    const made = URL.createObjectURL(image.data);
    setSrc(made);
    return () => {
      URL.revokeObjectURL(made);
      setSrc(null);
    };
  }, [image.data]);
  return { src, failed: image.isError };
}

/**
 * Whether a signed record still hashes to the fingerprint kept with its signature, worked out
 * on this phone (null while working).
 */
export function useFingerprintCheck(record: unknown, recordHash: string): boolean | null {
  const [matches, setMatches] = useState<boolean | null>(null);
  useEffect(() => {
    let live = true;
    setMatches(null);
    hashOfRecord(record as Parameters<typeof hashOfRecord>[0])
      .then((h) => {
        if (live) setMatches(h === recordHash);
      })
      .catch(() => {
        if (live) setMatches(false);
      });
    return () => {
      live = false;
    };
  }, [record, recordHash]);
  return matches;
}
