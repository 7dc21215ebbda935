import {
  isJobStage,
  STAGE_LABELS,
  type CustomerRow,
  type JobRow,
  type JobStage,
  type VehicleRow,
} from '@panelpass/shared';
import { customerName, vehicleDetails, vehicleLabel } from '../../workspace/model/jobWords';

/** A visit with what tells it apart: the car, its owner, where and when. */
export interface JobSummary {
  job: JobRow;
  stage: JobStage;
  customer: CustomerRow | null;
  vehicle: VehicleRow | null;
  /** "2019 Harrow Ridgeback". */
  vehicleName: string;
  /** "white · pickup · LKB 4471". */
  vehicleDetails: string;
  customerName: string;
  startMs: number;
  endMs: number;
}

export function summarise(
  jobs: readonly JobRow[],
  customers: ReadonlyMap<string, CustomerRow>,
  vehicles: ReadonlyMap<string, VehicleRow>,
): JobSummary[] {
  return jobs.map((job) => {
    const customer = customers.get(job.customerId) ?? null;
    const vehicle = vehicles.get(job.vehicleId) ?? null;
    return {
      job,
      stage: isJobStage(job.stage) ? job.stage : 'booked',
      customer,
      vehicle,
      vehicleName: vehicleLabel(vehicle),
      vehicleDetails: vehicleDetails(vehicle),
      customerName: customerName(customer),
      startMs: Date.parse(job.windowStart),
      endMs: Date.parse(job.windowEnd),
    };
  });
}

export function startOfLocalDay(ms: number): number {
  const d = new Date(ms);
  d.setHours(0, 0, 0, 0);
  return d.getTime();
}

/** The visits whose window starts on the phone's local day of `nowMs`, by start time. */
export function jobsOfDay<T extends Pick<JobSummary, 'startMs'>>(
  jobs: readonly T[],
  nowMs: number,
): T[] {
  const from = startOfLocalDay(nowMs);
  const to = startOfLocalDay(from + 36 * 3_600_000); // the next local midnight, summer time or not
  return jobs
    .filter((j) => j.startMs >= from && j.startMs < to)
    .sort((a, b) => a.startMs - b.startMs);
}

const fold = (text: string) =>
  text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase();

/**
 * Whether a visit matches what was typed: every word must appear in the customer's name, the
 * vehicle (make, model, colour, year), the plate (spaces ignored) or the address.
 */
export function matchesSearch(s: JobSummary, query: string): boolean {
  const words = fold(query).split(/\s+/).filter(Boolean);
  if (!words.length) return true;
  const v = s.vehicle;
  const haystack = fold(
    [
      s.customerName,
      s.vehicleName,
      v?.colour ?? '',
      v?.plate ?? '',
      (v?.plate ?? '').replace(/\s+/g, ''),
      s.job.address,
      STAGE_LABELS[s.stage],
    ].join(' \u0001 '),
  );
  return words.every((w) => haystack.includes(w));
}
