import { useLiveQuery } from 'dexie-react-hooks';
import type { ClimateReadingRow } from '@panelpass/shared';
import { useLocalDb } from '../../../db/hooks';

/**
 * Every climate reading of a job, oldest first (live): the series the cure planner reads.
 * Undefined while loading; an empty list when there is none (or no job).
 */
export function useJobClimate(jobId: string | null | undefined): ClimateReadingRow[] | undefined {
  const db = useLocalDb();
  return useLiveQuery(async () => {
    if (!db || !jobId) return [];
    const rows = await db.rows('climate_readings').where('jobId').equals(jobId).toArray();
    return rows.sort((a, b) => Date.parse(a.takenAt) - Date.parse(b.takenAt));
  }, [db, jobId]);
}

/**
 * The latest climate reading of a job (live): what the climate gate and the planners use.
 * Undefined while loading; null when the job has none yet.
 */
export function useLatestClimate(
  jobId: string | null | undefined,
): ClimateReadingRow | null | undefined {
  const all = useJobClimate(jobId);
  if (all === undefined) return undefined;
  return all.at(-1) ?? null;
}
