/**
 * Times in the detailer's words, shared by the stage screens (prep, correction, chips,
 * finish): "14:32", "Fri 16 May, 14:05", "2:41 left", "3 min 10 s late". Every time is an
 * absolute instant (epoch ms, server clock); nothing here counts ticks.
 */

const SECOND = 1000;
const MINUTE = 60 * SECOND;
const HOUR = 60 * MINUTE;
const DAY = 24 * HOUR;

import { clockTime } from './clockTime';

export { clockTime };

/**
 * The time, with the day when it is not the same day as `nowMs`: "14:05", "14:05 tomorrow",
 * "Fri 16 May, 14:05".
 */
export function dayAndTime(ms: number, nowMs: number, locale?: string): string {
  const at = new Date(ms);
  if (at.toDateString() === new Date(nowMs).toDateString()) return clockTime(ms, locale);
  if (new Date(nowMs + DAY).toDateString() === at.toDateString()) {
    return `${clockTime(ms, locale)} tomorrow`;
  }
  const day = at.toLocaleDateString(locale, { weekday: 'short', day: 'numeric', month: 'short' });
  return `${day}, ${clockTime(ms, locale)}`;
}

/** When a record was signed: "14:05 on 2 Dec 2026" (empty for a time that is not one). */
export function signedWhen(iso: string, locale?: string): string {
  const at = new Date(iso);
  if (Number.isNaN(at.getTime())) return '';
  const day = at.toLocaleDateString(locale, { day: 'numeric', month: 'short', year: 'numeric' });
  return `${clockTime(at.getTime(), locale)} on ${day}`;
}

/** "at 14:05" today, else "14:05 tomorrow" or "Fri 16 May, 14:05" (after a verb). */
export function atWords(ms: number, nowMs: number, locale?: string): string {
  const sameDay = new Date(ms).toDateString() === new Date(nowMs).toDateString();
  return sameDay ? `at ${clockTime(ms, locale)}` : dayAndTime(ms, nowMs, locale);
}

const pad2 = (n: number) => String(n).padStart(2, '0');

/**
 * A short wait as a clock would show it: "4:05" (minutes:seconds) under an hour, "1:04:05"
 * beyond. Rounded up, so "0:00" only shows when the time has come.
 */
export function countdown(ms: number): string {
  const total = Math.max(0, Math.ceil(ms / SECOND));
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = total % 60;
  return h > 0 ? `${h}:${pad2(m)}:${pad2(s)}` : `${m}:${pad2(s)}`;
}

/**
 * A length of time in words: "40 s", "3 min", "3 min 10 s", "2 h 05 min", "2 days 4 h".
 * Seconds are shown only under ten minutes (where they matter for a flush).
 */
export function durationWords(ms: number): string {
  const abs = Math.max(0, Math.round(ms / SECOND)) * SECOND;
  if (abs < MINUTE) return `${abs / SECOND} s`;
  if (abs < 10 * MINUTE) {
    const m = Math.floor(abs / MINUTE);
    const s = Math.round((abs % MINUTE) / SECOND);
    return s === 0 ? `${m} min` : `${m} min ${s} s`;
  }
  if (abs < HOUR) return `${Math.round(abs / MINUTE)} min`;
  if (abs < 2 * DAY) {
    const h = Math.floor(abs / HOUR);
    const m = Math.round((abs % HOUR) / MINUTE);
    return m === 0 ? `${h} h` : m === 60 ? `${h + 1} h` : `${h} h ${pad2(m)} min`;
  }
  const d = Math.floor(abs / DAY);
  const h = Math.round((abs % DAY) / HOUR);
  return h === 0 ? `${d} days` : `${d} days ${h} h`;
}

/** Hours as people say them: "12 h", "14.5 h", "1 h". */
export function hoursWords(hours: number): string {
  const rounded = Math.round(hours * 10) / 10;
  return `${Number.isInteger(rounded) ? rounded.toFixed(0) : rounded.toFixed(1)} h`;
}
