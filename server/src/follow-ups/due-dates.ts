/**
 * When a follow-up e-mail is due. The rules, in the business's own time zone:
 *
 * - **Maintenance reminder**: the calendar day the job closed, plus N calendar months, at
 *   09:00. A day the target month does not have becomes that month's last day (31 Jan + 1
 *   month = 28 Feb, or 29 Feb in a leap year; 31 Aug + 1 month = 30 Sep), so a reminder never
 *   spills into the month after the one asked for.
 * - **Appointment reminder**: the same wall-clock time on the calendar day before the visit's
 *   window starts (a booking at 08:30 on the 12th: 08:30 on the 11th). Across a clock change
 *   this is 23 or 25 hours before, never a different clock time.
 *
 * A wall-clock time a clock change skips (02:30 on a spring-forward night) is read with the
 * offset in force before the change, so it lands the length of the change later; a time that
 * happens twice takes the first.
 */

/** The hour of the day maintenance reminders go out, in the business's time zone. */
export const MAINTENANCE_REMINDER_HOUR = 9;

export interface WallClock {
  year: number;
  /** 1–12 */
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
  millisecond: number;
}

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
      second: 'numeric',
    });
    formatters.set(timeZone, f);
  }
  return f;
}

/** What a clock in `timeZone` reads at `at`. */
export function wallClock(at: Date, timeZone: string): WallClock {
  const parts: Record<string, number> = {};
  for (const p of formatter(timeZone).formatToParts(at)) {
    if (p.type !== 'literal') parts[p.type] = Number(p.value);
  }
  return {
    year: parts.year!,
    month: parts.month!,
    day: parts.day!,
    hour: parts.hour! % 24,
    minute: parts.minute!,
    second: parts.second!,
    millisecond: at.getUTCMilliseconds(),
  };
}

const asUtc = (c: WallClock): number =>
  Date.UTC(c.year, c.month - 1, c.day, c.hour, c.minute, c.second, c.millisecond);

const DAY_MS = 86_400_000;

/** How far `timeZone` is ahead of UTC at `at`, in ms. */
function offsetAt(at: number, timeZone: string): number {
  return asUtc(wallClock(new Date(at), timeZone)) - at;
}

/** The instant a clock in `timeZone` reads `c` (see the module comment for skipped times). */
export function instantOf(c: WallClock, timeZone: string): Date {
  const local = asUtc(c);
  // The offsets in force a day either side (a zone changes its clocks at most once in that
  // time): each that reads `c` at `local − offset` gives an instant showing `c`.
  const before = offsetAt(local - DAY_MS, timeZone);
  const after = offsetAt(local + DAY_MS, timeZone);
  const showing = [before, after]
    .map((offset) => local - offset)
    .filter((t) => asUtc(wallClock(new Date(t), timeZone)) === local);
  if (showing.length) return new Date(Math.min(...showing));
  // `c` does not exist (skipped by the change): read it with the offset before the change.
  return new Date(local - before);
}

export function daysInMonth(year: number, month: number): number {
  return new Date(Date.UTC(year, month, 0)).getUTCDate();
}

/** A calendar date plus whole months, the day clamped to the target month's last day. */
export function addMonths(
  date: { year: number; month: number; day: number },
  months: number,
): { year: number; month: number; day: number } {
  const index = date.year * 12 + (date.month - 1) + months;
  const year = Math.floor(index / 12);
  const month = index - year * 12 + 1;
  return { year, month, day: Math.min(date.day, daysInMonth(year, month)) };
}

/** A calendar date plus whole days. */
function addDays(
  date: { year: number; month: number; day: number },
  days: number,
): { year: number; month: number; day: number } {
  const d = new Date(Date.UTC(date.year, date.month - 1, date.day + days));
  return { year: d.getUTCFullYear(), month: d.getUTCMonth() + 1, day: d.getUTCDate() };
}

/** The maintenance reminder of a job that closed at `closedAt` (see the module comment). */
export function maintenanceDueAt(closedAt: Date, months: number, timeZone: string): Date {
  const target = addMonths(wallClock(closedAt, timeZone), months);
  return instantOf(
    { ...target, hour: MAINTENANCE_REMINDER_HOUR, minute: 0, second: 0, millisecond: 0 },
    timeZone,
  );
}

/** The appointment reminder of a visit whose window starts at `windowStart`. */
export function appointmentDueAt(windowStart: Date, timeZone: string): Date {
  const start = wallClock(windowStart, timeZone);
  return instantOf({ ...start, ...addDays(start, -1) }, timeZone);
}

/** `timeZone` if this runtime knows it, else UTC (a business's zone is checked when saved). */
export function knownZone(timeZone: string | null | undefined): string {
  if (!timeZone) return 'UTC';
  try {
    formatter(timeZone);
    return timeZone;
  } catch {
    return 'UTC';
  }
}
