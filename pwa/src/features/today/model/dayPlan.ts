import { driveEstimate, InputError, type DriveSettings } from '@panelpass/shared';

export interface Stop {
  job: { lat: number | null; lng: number | null; address: string };
  startMs: number;
  endMs: number;
}

/** The drive to a visit from the one before it. */
export type Leg =
  | { kind: 'first' }
  | { kind: 'unknown'; words: string }
  | {
      kind: 'drive';
      minutes: number;
      roadKm: number;
      /** "About 12 min drive from the previous visit (8.4 km by road)". */
      words: string;
      /** Set when the drive does not fit between the two windows. */
      tight: string | null;
      /** How it was estimated (shared reason, with its basis). */
      how: string;
    };

function minutesWords(min: number): string {
  if (min < 60) return `${min} min`;
  return `${Math.floor(min / 60)} h ${String(min % 60).padStart(2, '0')} min`;
}

const hasPosition = (s: Stop) => typeof s.job.lat === 'number' && typeof s.job.lng === 'number';

/**
 * For each visit of the day (in order), the drive from the previous one: shared
 * `driveEstimate` (great-circle distance × road factor ÷ average speed) with the business's
 * factors, rounded up to the minute; and whether it fits between the previous visit's end and
 * this one's start.
 */
export function dayLegs(stops: readonly Stop[], drive: DriveSettings): Leg[] {
  return stops.map((stop, i): Leg => {
    const previous = stops[i - 1];
    if (!previous) return { kind: 'first' };
    if (!hasPosition(previous) || !hasPosition(stop)) {
      return {
        kind: 'unknown',
        words: 'Drive time unknown: an address has no map position.',
      };
    }
    let estimate;
    try {
      estimate = driveEstimate(
        { lat: previous.job.lat!, lng: previous.job.lng! },
        { lat: stop.job.lat!, lng: stop.job.lng! },
        drive,
      );
    } catch (error) {
      if (error instanceof InputError) {
        return { kind: 'unknown', words: 'Drive time unknown: a map position is not valid.' };
      }
      throw error;
    }
    const minutes = Math.ceil(estimate.minutes);
    const km = Math.round(estimate.roadKm * 10) / 10;
    const words =
      minutes === 0
        ? 'Same place as the previous visit: no drive.'
        : `About ${minutesWords(minutes)} drive from the previous visit (${km} km by road).`;
    const gapMin = Math.floor((stop.startMs - previous.endMs) / 60_000);
    const tight =
      minutes > 0 && gapMin < minutes
        ? gapMin <= 0
          ? `The previous visit runs until this one starts: the drive needs about ${minutesWords(minutes)} more.`
          : `Only ${minutesWords(gapMin)} between the visits for a drive of about ${minutesWords(minutes)}.`
        : null;
    return {
      kind: 'drive',
      minutes,
      roadKm: km,
      words,
      tight,
      how: `${estimate.reasons[0]?.message ?? ''} (${estimate.reasons[0]?.basis ?? ''})`,
    };
  });
}
