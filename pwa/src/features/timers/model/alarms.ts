import type { TimerRow } from '@panelpass/shared';
import { isLive, timerState } from './timerWords';

type AlarmTimer = Pick<
  TimerRow,
  'id' | 'endsAt' | 'pausedMs' | 'pausedAt' | 'acknowledgedAt' | 'cancelledAt'
>;

/**
 * What this phone remembers about alarms, per timer id, with the end time it was about (a
 * paused and resumed timer has a new end, and rings again):
 * - `sounded`: the alarm sounded (or a notification went out) for this end;
 * - `onTime`: it sounded at its end while the app was on screen — it was not missed.
 */
export interface AlarmMemory {
  sounded: Record<string, string>;
  onTime: Record<string, string>;
}

export const emptyMemory = (): AlarmMemory => ({ sounded: {}, onTime: {} });

/** How long after its end a timer found ended still sounds when the app comes back. */
export const FRESH_ALARM_MS = 5 * 60_000;

/**
 * When the next alarm is due: the nearest end among running timers still to end. The shell
 * sets one timeout to it (and looks again when the app comes back to the screen), so no
 * ticking is counted: a page in the background may have its timeouts delayed, never lost.
 */
export function nextAlarm(
  timers: readonly AlarmTimer[],
  nowMs: number,
): { id: string; atMs: number; inMs: number } | null {
  let next: { id: string; atMs: number } | null = null;
  for (const t of timers) {
    if (timerState(t, nowMs) !== 'running') continue;
    const atMs = Date.parse(t.endsAt);
    if (!next || atMs < next.atMs) next = { id: t.id, atMs };
  }
  return next ? { ...next, inMs: Math.max(0, next.atMs - nowMs) } : null;
}

export interface AlarmPlan<T> {
  /** Sound, vibrate and show now (on screen, ended just now or while away a moment ago). */
  ring: T[];
  /** Of those, the ones that ended while the app was on screen: rung on time, not missed. */
  onTime: T[];
  /** Send a notification (the app is hidden; with permission). */
  notify: T[];
}

/**
 * What to do at `nowMs` for timers that have ended and not been acknowledged, given what the
 * phone already did. `visibleSinceMs` is when the app last came on screen (server clock),
 * null while it is hidden. On screen, a timer that ended within FRESH_ALARM_MS rings once;
 * older ones stay silent (the missed-alarm banner shows them). Hidden, each ended timer gets
 * one notification instead.
 */
export function planAlarms<T extends AlarmTimer>(
  timers: readonly T[],
  nowMs: number,
  memory: AlarmMemory,
  visibleSinceMs: number | null,
): AlarmPlan<T> {
  const plan: AlarmPlan<T> = { ring: [], onTime: [], notify: [] };
  for (const t of timers) {
    if (timerState(t, nowMs) !== 'ended') continue;
    if (memory.sounded[t.id] === t.endsAt) continue;
    const endMs = Date.parse(t.endsAt);
    if (visibleSinceMs === null) plan.notify.push(t);
    else if (nowMs - endMs <= FRESH_ALARM_MS) {
      plan.ring.push(t);
      if (visibleSinceMs <= endMs) plan.onTime.push(t);
    }
  }
  return plan;
}

/**
 * Missed alarms: timers that ended and are not acknowledged, whose alarm did not sound at
 * their end with the app on screen (it was closed, hidden, or the end passed on another
 * phone). They show as a banner until acknowledged.
 */
export function missedAlarms<T extends AlarmTimer>(
  timers: readonly T[],
  nowMs: number,
  memory: AlarmMemory,
): T[] {
  return timers.filter((t) => timerState(t, nowMs) === 'ended' && memory.onTime[t.id] !== t.endsAt);
}

/** Records what was done, and forgets timers no longer on screen. */
export function remember(
  memory: AlarmMemory,
  done: { sounded?: readonly AlarmTimer[]; onTime?: readonly AlarmTimer[] },
  live: readonly AlarmTimer[],
): AlarmMemory {
  const keep = new Set(live.filter(isLive).map((t) => t.id));
  const prune = (m: Record<string, string>) =>
    Object.fromEntries(Object.entries(m).filter(([id]) => keep.has(id)));
  const sounded = prune(memory.sounded);
  const onTime = prune(memory.onTime);
  for (const t of done.sounded ?? []) sounded[t.id] = t.endsAt;
  for (const t of done.onTime ?? []) onTime[t.id] = t.endsAt;
  return { sounded, onTime };
}

export function readMemory(storage: Storage | null, key: string): AlarmMemory {
  try {
    const parsed: unknown = JSON.parse(storage?.getItem(key) ?? 'null');
    if (parsed && typeof parsed === 'object') {
      const m = parsed as Partial<AlarmMemory>;
      return { sounded: { ...(m.sounded ?? {}) }, onTime: { ...(m.onTime ?? {}) } };
    }
  } catch {
    // Unreadable: start afresh (at worst an alarm sounds once more).
  }
  return emptyMemory();
}

export function writeMemory(storage: Storage | null, key: string, memory: AlarmMemory): void {
  try {
    storage?.setItem(key, JSON.stringify(memory));
  } catch {
    // Storage full or blocked: the memory holds for this session.
  }
}
