import { useLiveQuery } from 'dexie-react-hooks';
import type {
  CustomerRow,
  FilmReadingRow,
  JobPanelRow,
  JobRow,
  PhotoRow,
  SignatureRow,
  VehicleRow,
} from '@panelpass/shared';
import { useLocalDb } from '../../../db/hooks';

/** Every customer and vehicle on this phone (live); undefined while loading. */
export function useClients(): { customers: CustomerRow[]; vehicles: VehicleRow[] } | undefined {
  const db = useLocalDb();
  return useLiveQuery(async () => {
    if (!db) return { customers: [], vehicles: [] };
    const [customers, vehicles] = await Promise.all([
      db.rows('customers').toArray(),
      db.rows('vehicles').toArray(),
    ]);
    return { customers, vehicles };
  }, [db]);
}

export interface CustomerFile {
  customer: CustomerRow | null;
  vehicles: VehicleRow[];
  jobs: JobRow[];
}

/** One customer with their vehicles and visits (undefined while loading). */
export function useCustomerFile(customerId: string | undefined): CustomerFile | undefined {
  const db = useLocalDb();
  return useLiveQuery(async () => {
    if (!db || !customerId) return { customer: null, vehicles: [], jobs: [] };
    const [customer, vehicles, jobs] = await Promise.all([
      db.rows('customers').get(customerId),
      db.rows('vehicles').where('customerId').equals(customerId).toArray(),
      db.rows('jobs').where('customerId').equals(customerId).toArray(),
    ]);
    return { customer: customer ?? null, vehicles, jobs };
  }, [db, customerId]);
}

export interface VehicleFile {
  vehicle: VehicleRow | null;
  customer: CustomerRow | null;
  /** Newest first. */
  jobs: JobRow[];
  panels: JobPanelRow[];
  readings: FilmReadingRow[];
  photos: PhotoRow[];
  signatures: SignatureRow[];
}

/**
 * A vehicle's history as this phone holds it: its visits, their panels and film readings,
 * the photos of it and the signatures on its visits (undefined while loading).
 */
export function useVehicleFile(vehicleId: string | undefined): VehicleFile | undefined {
  const db = useLocalDb();
  return useLiveQuery(async () => {
    const none: VehicleFile = {
      vehicle: null,
      customer: null,
      jobs: [],
      panels: [],
      readings: [],
      photos: [],
      signatures: [],
    };
    if (!db || !vehicleId) return none;
    const vehicle = await db.rows('vehicles').get(vehicleId);
    if (!vehicle) return none;
    const [customer, jobs, photos] = await Promise.all([
      db.rows('customers').get(vehicle.customerId),
      db.rows('jobs').where('vehicleId').equals(vehicleId).toArray(),
      db.rows('photos').where('vehicleId').equals(vehicleId).toArray(),
    ]);
    const jobIds = jobs.map((j) => j.id);
    const [panels, readings, signatures] = await Promise.all([
      db.rows('job_panels').where('jobId').anyOf(jobIds).toArray(),
      db.rows('film_readings').where('jobId').anyOf(jobIds).toArray(),
      db.rows('signatures').where('jobId').anyOf(jobIds).toArray(),
    ]);
    jobs.sort((a, b) => b.windowStart.localeCompare(a.windowStart) || a.id.localeCompare(b.id));
    photos.sort((a, b) => a.takenAt.localeCompare(b.takenAt) || a.id.localeCompare(b.id));
    signatures.sort((a, b) => b.signedAt.localeCompare(a.signedAt));
    return { vehicle, customer: customer ?? null, jobs, panels, readings, photos, signatures };
  }, [db, vehicleId]);
}
