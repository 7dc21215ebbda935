import { driveEstimate, isInputError, type DriveSettings } from '@panelpass/shared';

/** A booked visit as the calendar lays it out. */
export interface Booking {
  id: string;
  startMs: number;
  endMs: number;
  lat: number | null;
  lng: number | null;
  /** Who does it: a helper's user id, or null for the owner. */
  assignedTechId: string | null;
}

/** Something wrong between this stop and another of the same person's day. */
export type Conflict =
  | { kind: 'overlap'; withId: string; words: string }
  | { kind: 'short-gap'; withId: string; gapMin: number; driveMin: number; words: string };

/** The drive from the person's previous stop: minutes rounded up, or unknown (no position). */
export type Leg = { kind: 'drive'; minutes: number; roadKm: number } | { kind: 'unknown' } | null;

export interface Stop<B extends Booking> {
  booking: B;
  leg: Leg;
  conflicts: Conflict[];
}

/** One person's stops of one day, in order of start. */
export interface Route<B extends Booking> {
  who: string | null;
  stops: Stop<B>[];
}

export interface CalendarDay<B extends Booking> {
  /** Local midnight. */
  dayMs: number;
  routes: Route<B>[];
  bookings: number;
  conflicts: number;
}

const MIN = 60_000;

/** Local midnight of the day `ms` falls in. */
export function startOfDay(ms: number): number {
  const d = new Date(ms);
  d.setHours(0, 0, 0, 0);
  return d.getTime();
}

/** The local midnight `n` days after `dayMs` (a summer-time day has 23 or 25 hours). */
export function addDays(dayMs: number, n: number): number {
  const d = new Date(dayMs);
  d.setDate(d.getDate() + n);
  d.setHours(0, 0, 0, 0);
  return d.getTime();
}

/** The Monday (local midnight) of the week `ms` falls in. */
export function startOfWeek(ms: number): number {
  const day = startOfDay(ms);
  const weekday = (new Date(day).getDay() + 6) % 7; // Monday 0 … Sunday 6
  return addDays(day, -weekday);
}

function hhmm(ms: number): string {
  const d = new Date(ms);
  return `${String(d.getHours()).padStart(2, '0')}:${String(d.getMinutes()).padStart(2, '0')}`;
}

function minutesWords(min: number): string {
  if (min < 60) return `${min} min`;
  return `${Math.floor(min / 60)} h${min % 60 ? ` ${String(min % 60).padStart(2, '0')} min` : ''}`;
}

const positioned = (b: Booking) => typeof b.lat === 'number' && typeof b.lng === 'number';

/**
 * The drive between two stops: shared `driveEstimate` (straight-line distance × road factor ÷
 * average speed, the business's factors), rounded up to the minute; unknown without positions.
 */
export function legBetween(from: Booking, to: Booking, drive: DriveSettings): Leg {
  if (!positioned(from) || !positioned(to)) return { kind: 'unknown' };
  try {
    const e = driveEstimate(
      { lat: from.lat!, lng: from.lng! },
      { lat: to.lat!, lng: to.lng! },
      drive,
    );
    return {
      kind: 'drive',
      minutes: Math.max(0, Math.ceil(e.minutes - 1e-9)),
      roadKm: Math.round(e.roadKm * 10) / 10,
    };
  } catch (error) {
    if (isInputError(error)) return { kind: 'unknown' };
    throw error;
  }
}

/**
 * One person's day, in order of start, with the drive from each stop to the next and the
 * conflicts (our own rule): two windows that overlap (any two, not only neighbours), and a
 * gap between a stop's end and the next stop's start shorter than the drive between them.
 * Touching windows (one ends as the next starts) do not overlap, but leave no time to drive.
 */
export function layoutRoute<B extends Booking>(
  bookings: readonly B[],
  drive: DriveSettings,
): Stop<B>[] {
  const sorted = [...bookings].sort((a, b) => a.startMs - b.startMs || a.endMs - b.endMs);
  const stops: Stop<B>[] = sorted.map((booking) => ({ booking, leg: null, conflicts: [] }));
  for (let i = 0; i < stops.length; i++) {
    const a = stops[i]!;
    for (let j = i + 1; j < stops.length; j++) {
      const b = stops[j]!;
      if (b.booking.startMs >= a.booking.endMs) continue;
      const span = (s: Stop<B>) => `${hhmm(s.booking.startMs)}–${hhmm(s.booking.endMs)}`;
      a.conflicts.push({
        kind: 'overlap',
        withId: b.booking.id,
        words: `Overlaps the visit at ${span(b)}.`,
      });
      b.conflicts.push({
        kind: 'overlap',
        withId: a.booking.id,
        words: `Overlaps the visit at ${span(a)}.`,
      });
    }
    if (i === 0) continue;
    const prev = stops[i - 1]!;
    const leg = legBetween(prev.booking, a.booking, drive);
    a.leg = leg;
    const gapMin = Math.floor((a.booking.startMs - prev.booking.endMs) / MIN);
    if (leg?.kind === 'drive' && leg.minutes > 0 && gapMin >= 0 && gapMin < leg.minutes) {
      a.conflicts.push({
        kind: 'short-gap',
        withId: prev.booking.id,
        gapMin,
        driveMin: leg.minutes,
        words:
          gapMin === 0
            ? `No time to drive from the visit before (about ${minutesWords(leg.minutes)}).`
            : `Only ${minutesWords(gapMin)} after the visit before, for a drive of about ${minutesWords(leg.minutes)}.`,
      });
    }
  }
  return stops;
}

/** The bookings of one local day (by start), one route per person, owner's first. */
export function layoutDay<B extends Booking>(
  bookings: readonly B[],
  dayMs: number,
  drive: DriveSettings,
): CalendarDay<B> {
  const from = startOfDay(dayMs);
  const to = addDays(from, 1);
  const today = bookings.filter((b) => b.startMs >= from && b.startMs < to);
  const byWho = new Map<string | null, B[]>();
  for (const b of today) {
    const list = byWho.get(b.assignedTechId) ?? [];
    list.push(b);
    byWho.set(b.assignedTechId, list);
  }
  const routes = [...byWho.entries()]
    .sort(([a], [b]) => (a === null ? -1 : b === null ? 1 : a.localeCompare(b)))
    .map(([who, list]) => ({ who, stops: layoutRoute(list, drive) }));
  return {
    dayMs: from,
    routes,
    bookings: today.length,
    conflicts: routes.reduce((n, r) => n + r.stops.filter((s) => s.conflicts.length > 0).length, 0),
  };
}

/** Seven days from the Monday of `anyMs`'s week. */
export function layoutWeek<B extends Booking>(
  bookings: readonly B[],
  anyMs: number,
  drive: DriveSettings,
): CalendarDay<B>[] {
  const monday = startOfWeek(anyMs);
  return Array.from({ length: 7 }, (_, i) => layoutDay(bookings, addDays(monday, i), drive));
}

/**
 * Where a booking stands in a day drawn from `fromHour` to `toHour`: top and height as
 * fractions of the day's height (clipped to it), for the week's columns.
 */
export function placeInDay(
  b: Pick<Booking, 'startMs' | 'endMs'>,
  dayMs: number,
  fromHour = 6,
  toHour = 21,
): { top: number; height: number } {
  const start = dayMs + fromHour * 3_600_000;
  const span = (toHour - fromHour) * 3_600_000;
  const top = Math.min(1, Math.max(0, (b.startMs - start) / span));
  const bottom = Math.min(1, Math.max(0, (b.endMs - start) / span));
  return { top, height: Math.max(0, bottom - top) };
}

/**
 * A booking's window moved: to a new start (same length), or with a new end. Refused (null)
 * when the end would not be after the start.
 */
export function movedWindow(
  b: Pick<Booking, 'startMs' | 'endMs'>,
  change: { startMs?: number; endMs?: number },
): { windowStart: string; windowEnd: string } | null {
  const startMs = change.startMs ?? b.startMs;
  const endMs =
    change.endMs ?? (change.startMs !== undefined ? startMs + (b.endMs - b.startMs) : b.endMs);
  if (!(endMs > startMs)) return null;
  return { windowStart: new Date(startMs).toISOString(), windowEnd: new Date(endMs).toISOString() };
}
