import type { CustomerRow, JobRow, VehicleRow } from '@panelpass/shared';

/** "2018 Borrow Tundrel" — the vehicle as the detailer says it. */
export function vehicleLabel(
  vehicle: Pick<VehicleRow, 'year' | 'make' | 'model'> | null | undefined,
): string {
  if (!vehicle) return 'Vehicle';
  const words = [vehicle.year ?? '', vehicle.make, vehicle.model]
    .map(String)
    .filter((w) => w.trim());
  return words.length ? words.join(' ') : 'Vehicle';
}

/** "black · LKB 3317" — what tells this car from the next one in the street. */
export function vehicleDetails(
  vehicle: Pick<VehicleRow, 'colour' | 'plate' | 'bodyStyle'> | null | undefined,
): string {
  if (!vehicle) return '';
  return [vehicle.colour, bodyStyleWords(vehicle.bodyStyle), vehicle.plate]
    .filter((w): w is string => typeof w === 'string' && w.trim() !== '')
    .join(' · ');
}

const BODY_WORDS: Record<string, string> = {
  sedan: 'sedan',
  hatchback: 'hatchback',
  coupe: 'coupé',
  wagon: 'wagon',
  suv: 'SUV',
  pickup: 'pickup',
  van: 'van',
};

export function bodyStyleWords(style: string): string {
  return BODY_WORDS[style] ?? style;
}

const dayMs = 24 * 60 * 60 * 1000;

function startOfDay(ms: number): number {
  const d = new Date(ms);
  d.setHours(0, 0, 0, 0);
  return d.getTime();
}

/**
 * "Today, 08:00–13:00", "Yesterday, …", "Tomorrow, …", else "Tue 6 May, 09:00–14:00".
 * Local time of the phone, 24-hour or 12-hour as the locale writes it.
 */
export function windowWords(
  job: Pick<JobRow, 'windowStart' | 'windowEnd'>,
  nowMs: number = Date.now(),
  locale?: string,
): string {
  const start = Date.parse(job.windowStart);
  const end = Date.parse(job.windowEnd);
  if (Number.isNaN(start) || Number.isNaN(end)) return '';
  const time = (ms: number) =>
    new Date(ms).toLocaleTimeString(locale, { hour: '2-digit', minute: '2-digit' });
  const days = Math.round((startOfDay(start) - startOfDay(nowMs)) / dayMs);
  const day =
    days === 0
      ? 'Today'
      : days === -1
        ? 'Yesterday'
        : days === 1
          ? 'Tomorrow'
          : new Date(start).toLocaleDateString(locale, {
              weekday: 'short',
              day: 'numeric',
              month: 'short',
            });
  return `${day}, ${time(start)}–${time(end)}`;
}

/** The customer's name, or a stand-in while the row is not on the phone. */
export function customerName(customer: Pick<CustomerRow, 'name'> | null | undefined): string {
  return customer?.name?.trim() || 'Customer';
}
