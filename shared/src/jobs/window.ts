/**
 * The longest a visit's booked window may be: 14 days. Our own limit (no published source): a
 * multi-day correction with a coating's cure fits easily, and a bound lets the calendar and the
 * jobs list find the visits overlapping a range through the (business, window start) index
 * instead of reading every earlier visit.
 */
export const MAX_VISIT_WINDOW_DAYS = 14;
export const MAX_VISIT_WINDOW_MS = MAX_VISIT_WINDOW_DAYS * 24 * 60 * 60 * 1000;

/** What is wrong with a visit's window (end not after start, or longer than the limit), or null. */
export function visitWindowProblem(startMs: number, endMs: number): string | null {
  if (!(endMs > startMs)) return 'The visit must end after it starts';
  if (endMs - startMs > MAX_VISIT_WINDOW_MS)
    return `A visit may last at most ${MAX_VISIT_WINDOW_DAYS} days; book a longer one as several visits`;
  return null;
}
