import { describe, expect, it } from 'vitest';
import { byDue, remainingSpoken, remainingText, timerState } from './timerWords';

const T0 = Date.parse('2026-05-04T13:00:00.000Z');
const S = 1000;
const MIN = 60 * S;
const iso = (ms: number) => new Date(ms).toISOString();
const timer = (id: string, endsInMs: number, over: Record<string, unknown> = {}) => ({
  id,
  endsAt: iso(T0 + endsInMs),
  pausedMs: 0,
  pausedAt: null as string | null,
  acknowledgedAt: null as string | null,
  cancelledAt: null as string | null,
  ...over,
});

describe('remaining time in words, from the absolute end (never counted)', () => {
  it('mm:ss under an hour, seconds rounded up so 00:00 never shows early', () => {
    expect(remainingText(timer('a', 4 * MIN + 37 * S), T0)).toBe('04:37');
    expect(remainingText(timer('a', 4 * MIN + 36.2 * S), T0)).toBe('04:37');
    expect(remainingText(timer('a', 300), T0)).toBe('00:01');
  });

  it('h:mm:ss for hours, days for long keep-dry waits', () => {
    expect(remainingText(timer('a', 65 * MIN), T0)).toBe('1:05:00');
    expect(remainingText(timer('a', (2 * 24 + 3) * 60 * MIN), T0)).toBe('2 d 3 h');
  });

  it('"Due now" in the first minute after the end, then "3 min over"', () => {
    expect(remainingText(timer('a', 0), T0)).toBe('Due now');
    expect(remainingText(timer('a', -59 * S), T0)).toBe('Due now');
    expect(remainingText(timer('a', -3 * MIN - 10 * S), T0)).toBe('3 min over');
    expect(remainingText(timer('a', -65 * MIN), T0)).toBe('1 h 05 min over');
  });

  it('a paused timer keeps the time it had when paused', () => {
    const paused = timer('a', 10 * MIN, { pausedAt: iso(T0 - 5 * MIN) });
    expect(timerState(paused, T0 + 60 * MIN)).toBe('paused');
    expect(remainingText(paused, T0 + 60 * MIN)).toBe('15:00');
    expect(remainingSpoken(paused, T0 + 60 * MIN)).toBe('paused with 15 minutes left');
  });

  it('says it in words for screen readers', () => {
    expect(remainingSpoken(timer('a', 4 * MIN + 37 * S), T0)).toBe('4 minutes 37 seconds left');
    expect(remainingSpoken(timer('a', 1 * S), T0)).toBe('1 second left');
    expect(remainingSpoken(timer('a', -3 * MIN), T0)).toBe('3 minutes over');
    expect(remainingSpoken(timer('a', -90 * MIN), T0)).toBe('1 hour 30 minutes over');
  });
});

describe('byDue — which timer the strip shows', () => {
  it('ended first (longest over first), then running by end, then paused; finished ones left out', () => {
    const timers = [
      timer('later', 20 * MIN),
      timer('paused', 2 * MIN, { pausedAt: iso(T0 - MIN) }),
      timer('over-1', -1 * MIN),
      timer('soon', 3 * MIN),
      timer('over-9', -9 * MIN),
      timer('acked', -20 * MIN, { acknowledgedAt: iso(T0) }),
      timer('cancelled', 1 * MIN, { cancelledAt: iso(T0) }),
    ];
    expect(byDue(timers, T0).map((t) => t.id)).toEqual([
      'over-9',
      'over-1',
      'soon',
      'later',
      'paused',
    ]);
  });
});
