import { timerRemainingMs, type TimerRow } from '@panelpass/shared';

/** The kinds of timer (the server's list) and how each is called on screen. */
export type TimerKind = 'cure' | 'flush' | 'dwell' | 'keep-dry' | 'custom';
export const TIMER_KINDS: readonly TimerKind[] = ['cure', 'flush', 'dwell', 'keep-dry', 'custom'];

export const KIND_WORDS: Record<TimerKind, string> = {
  cure: 'Cure',
  flush: 'Flush',
  dwell: 'Dwell',
  'keep-dry': 'Keep dry',
  custom: 'Timer',
};

export function kindOf(t: Pick<TimerRow, 'kind'>): TimerKind {
  return (TIMER_KINDS as readonly string[]).includes(t.kind) ? (t.kind as TimerKind) : 'custom';
}

export type TimerState = 'running' | 'paused' | 'ended' | 'acknowledged' | 'cancelled';

type Times = Pick<TimerRow, 'endsAt' | 'pausedMs' | 'pausedAt' | 'acknowledgedAt' | 'cancelledAt'>;

/** What a timer is doing at `nowMs` (server clock), from its stored times alone. */
export function timerState(t: Times, nowMs: number): TimerState {
  if (t.cancelledAt) return 'cancelled';
  if (t.acknowledgedAt) return 'acknowledged';
  if (t.pausedAt) return 'paused';
  return Date.parse(t.endsAt) <= nowMs ? 'ended' : 'running';
}

/** Still on screen: not acknowledged, not cancelled (running, paused or ended). */
export function isLive(t: Pick<TimerRow, 'acknowledgedAt' | 'cancelledAt'>): boolean {
  return !t.acknowledgedAt && !t.cancelledAt;
}

/** How long past its end a timer is (ms), 0 while it has time left or is paused. */
export function overMs(t: Times, nowMs: number): number {
  return timerState(t, nowMs) === 'ended' ? nowMs - Date.parse(t.endsAt) : 0;
}

const pad = (n: number) => String(n).padStart(2, '0');

function durationWords(totalMin: number): string {
  if (totalMin < 60) return `${totalMin} min`;
  const d = Math.floor(totalMin / 1440);
  const h = Math.floor((totalMin % 1440) / 60);
  const m = totalMin % 60;
  if (d > 0) return h > 0 ? `${d} d ${h} h` : `${d} d`;
  return `${h} h ${pad(m)} min`;
}

/**
 * What a timer shows: time left as "04:37" (or "1:05:00", "2 d 3 h" for long waits), and
 * once it has ended, "Due now" for the first minute, then "3 min over". Seconds are rounded
 * up, so "00:00" never shows while time is left.
 */
export function remainingText(t: Times, nowMs: number): string {
  const state = timerState(t, nowMs);
  if (state === 'ended') {
    const over = overMs(t, nowMs);
    return over < 60_000 ? 'Due now' : `${durationWords(Math.floor(over / 60_000))} over`;
  }
  const left = timerRemainingMs(t, nowMs);
  const s = Math.ceil(left / 1000);
  if (s >= 86_400) return durationWords(Math.ceil(s / 60));
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  const sec = s % 60;
  return h > 0 ? `${h}:${pad(m)}:${pad(sec)}` : `${pad(m)}:${pad(sec)}`;
}

const unit = (n: number, one: string) => `${n} ${one}${n === 1 ? '' : 's'}`;

/** The same for screen readers: "4 minutes 37 seconds left", "3 minutes over", "paused". */
export function remainingSpoken(t: Times, nowMs: number): string {
  const state = timerState(t, nowMs);
  if (state === 'ended') {
    const min = Math.floor(overMs(t, nowMs) / 60_000);
    return min < 1 ? 'due now' : `${minutesSpoken(min)} over`;
  }
  const s = Math.ceil(timerRemainingMs(t, nowMs) / 1000);
  const words =
    s >= 3600
      ? minutesSpoken(Math.ceil(s / 60))
      : s >= 60
        ? `${unit(Math.floor(s / 60), 'minute')}${s % 60 ? ` ${unit(s % 60, 'second')}` : ''}`
        : unit(s, 'second');
  return state === 'paused' ? `paused with ${words} left` : `${words} left`;
}

function minutesSpoken(totalMin: number): string {
  if (totalMin < 60) return unit(totalMin, 'minute');
  const h = Math.floor(totalMin / 60);
  const m = totalMin % 60;
  return m ? `${unit(h, 'hour')} ${unit(m, 'minute')}` : unit(h, 'hour');
}

/**
 * The order timers are shown in, and which one the strip shows: ended ones first (longest
 * over first: they are what needs doing), then running ones by end time, then paused ones by
 * time left.
 */
export function byDue<T extends Times>(timers: readonly T[], nowMs: number): T[] {
  const rank = (t: T) => {
    const state = timerState(t, nowMs);
    return state === 'ended' ? 0 : state === 'running' ? 1 : 2;
  };
  const key = (t: T) => (rank(t) === 2 ? timerRemainingMs(t, nowMs) : Date.parse(t.endsAt));
  return timers.filter((t) => isLive(t)).sort((a, b) => rank(a) - rank(b) || key(a) - key(b));
}
