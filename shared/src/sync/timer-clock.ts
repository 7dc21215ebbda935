import type { TimerRow } from './rows';

/** What a timer's remaining time is read from. */
export type TimerTimes = Pick<
  TimerRow,
  'endsAt' | 'pausedMs' | 'pausedAt' | 'acknowledgedAt' | 'cancelledAt'
>;

/** Time left on a timer at `nowMs` (server clock): frozen while paused, never below 0. */
export function timerRemainingMs(t: TimerTimes, nowMs: number): number {
  const from = t.pausedAt !== null ? Date.parse(t.pausedAt) : nowMs;
  return Math.max(0, Date.parse(t.endsAt) - from);
}
