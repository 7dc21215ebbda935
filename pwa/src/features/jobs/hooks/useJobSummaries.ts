import { useLiveQuery } from 'dexie-react-hooks';
import type { CustomerRow, VehicleRow } from '@panelpass/shared';
import { useLocalDb } from '../../../db/hooks';
import { summarise, type JobSummary } from '../model/jobSummary';

/**
 * Every visit on the phone with its customer and vehicle (live), in no particular order.
 * Undefined while loading.
 */
export function useJobSummaries(): JobSummary[] | undefined {
  const db = useLocalDb();
  return useLiveQuery(async () => {
    if (!db) return [];
    const [jobs, customers, vehicles] = await Promise.all([
      db.rows('jobs').toArray(),
      db.rows('customers').toArray(),
      db.rows('vehicles').toArray(),
    ]);
    return summarise(
      jobs,
      new Map<string, CustomerRow>(customers.map((c) => [c.id, c])),
      new Map<string, VehicleRow>(vehicles.map((v) => [v.id, v])),
    );
  }, [db]);
}
