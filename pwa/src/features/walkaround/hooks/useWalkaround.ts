import { useMemo } from 'react';
import type {
  CustomerRow,
  DamagePinRow,
  JobPanelRow,
  JobRow,
  PhotoRow,
  SignatureRow,
  VehicleRow,
} from '@panelpass/shared';
import { useJobRows, useRow } from '../../../db/hooks';
import { vehicleFilm, type VehicleFilm } from '../model/film';

export interface WalkaroundData {
  job: JobRow;
  vehicle: VehicleRow | null;
  customer: CustomerRow | null;
  /** Top-down, as the template orders them. */
  panels: JobPanelRow[];
  pins: DamagePinRow[];
  film: VehicleFilm;
  photos: PhotoRow[];
  /** Condition signatures, newest first. */
  signatures: SignatureRow[];
  /** Closed jobs take no more changes. */
  readOnly: boolean;
}

/**
 * Everything the walkaround shows, live from the phone's database: undefined while loading,
 * null when the job is not on this phone.
 */
export function useWalkaround(jobId: string): WalkaroundData | null | undefined {
  const job = useRow('jobs', jobId);
  const vehicle = useRow('vehicles', job?.vehicleId);
  const customer = useRow('customers', job?.customerId);
  const panels = useJobRows('job_panels', jobId, 'position');
  const pins = useJobRows('damage_pins', jobId, 'number');
  const readings = useJobRows('film_readings', jobId);
  const photos = useJobRows('photos', jobId, 'takenAt');
  const signatures = useJobRows('signatures', jobId);

  const film = useMemo(
    () => (panels && readings ? vehicleFilm(panels, readings) : undefined),
    [panels, readings],
  );

  return useMemo(() => {
    if (job === null) return null;
    if (!job || !panels || !pins || !film || !photos || !signatures) return undefined;
    return {
      job,
      vehicle: vehicle ?? null,
      customer: customer ?? null,
      panels,
      pins,
      film,
      photos,
      signatures: signatures
        .filter((s) => s.kind === 'condition')
        .sort((a, b) => b.signedAt.localeCompare(a.signedAt)),
      readOnly: job.stage === 'closed',
    };
  }, [job, vehicle, customer, panels, pins, film, photos, signatures]);
}
