import { useMemo } from 'react';
import type { JobRow, PaymentRow, SignatureRow, VehicleRow } from '@panelpass/shared';
import { useJobRows, useRow } from '../../../db/hooks';
import { buildAcceptanceRecord, type AcceptanceRecord } from '../model/handoverSummary';

export interface HandoverData {
  job: JobRow;
  vehicle: VehicleRow | null;
  record: AcceptanceRecord;
  /** Acceptance signatures, newest first. */
  signatures: SignatureRow[];
  payments: PaymentRow[];
  readOnly: boolean;
}

/**
 * The handover's rows, live from the phone's database: undefined while loading, null when the
 * job is not on this phone.
 */
export function useHandover(jobId: string): HandoverData | null | undefined {
  const job = useRow('jobs', jobId);
  const vehicle = useRow('vehicles', job?.vehicleId);
  const panels = useJobRows('job_panels', jobId, 'position');
  const passes = useJobRows('correction_passes', jobId);
  const chips = useJobRows('chips', jobId, 'number');
  const chipLayers = useJobRows('chip_layers', jobId);
  const timers = useJobRows('timers', jobId);
  const photos = useJobRows('photos', jobId);
  const signatures = useJobRows('signatures', jobId);
  const payments = useJobRows('payments', jobId);

  return useMemo(() => {
    if (job === null) return null;
    if (!job || !panels || !passes || !chips || !chipLayers || !timers || !photos) return undefined;
    if (!signatures || !payments) return undefined;
    return {
      job,
      vehicle: vehicle ?? null,
      record: buildAcceptanceRecord({
        job,
        vehicle: vehicle ?? null,
        panels,
        passes,
        chips,
        chipLayers,
        timers,
        photos,
      }),
      signatures: signatures
        .filter((s) => s.kind === 'acceptance')
        .sort((a, b) => b.signedAt.localeCompare(a.signedAt)),
      payments,
      readOnly: job.stage === 'closed',
    };
  }, [job, vehicle, panels, passes, chips, chipLayers, timers, photos, signatures, payments]);
}
